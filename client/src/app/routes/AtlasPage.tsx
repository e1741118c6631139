import { PlaceholderPage } from '../../components/PlaceholderPage';

export default function AtlasPage() {
  return (
    <PlaceholderPage title="Atlas">
      The storm record will be explored here: maps of storm onsets by time of day and weather regime, the
      daily cycle of onsets and cell properties, size and duration distributions, and storm motion. Nothing
      has been computed yet.
    </PlaceholderPage>
  );
}
