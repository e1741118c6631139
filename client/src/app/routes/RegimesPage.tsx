export { default } from '../../features/regimes/components/RegimesPage';
