import { PlaceholderPage } from '../../components/PlaceholderPage';

export default function IntakePage() {
  return (
    <PlaceholderPage title="Intake">
      Radar products, cell tables and anomaly grids will be uploaded here, and each intake job will show its
      progress, quality report and result.
    </PlaceholderPage>
  );
}
