import { PlaceholderPage } from '../../components/PlaceholderPage';

export default function ScorecardPage() {
  return (
    <PlaceholderPage title="Scorecard">
      Issued storm chances will be checked here against field reports and later radar onsets, by district and
      season.
    </PlaceholderPage>
  );
}
