import { PlaceholderPage } from '../../components/PlaceholderPage';

export default function OutlookPage() {
  return (
    <PlaceholderPage title="Outlook">
      The block outlook will appear here: for every block, the chance of a storm starting in each part of the
      day, with the number of days behind each figure and how sure it is.
    </PlaceholderPage>
  );
}
