export { default } from '../../features/scorecard/components/ScorecardPage';
