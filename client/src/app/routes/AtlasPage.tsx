export { default } from '../../features/atlas/components/AtlasPage';
