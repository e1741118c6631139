export { default } from '../../features/outlook/components/OutlookPage';
