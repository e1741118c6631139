import { PlaceholderPage } from '../../components/PlaceholderPage';

export default function RegimesPage() {
  return (
    <PlaceholderPage title="Regimes">
      Daily weather regimes, from the moisture and wind anomalies over the radar coverage, will be listed and
      reviewed here.
    </PlaceholderPage>
  );
}
