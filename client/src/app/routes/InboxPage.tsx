import { PlaceholderPage } from '../../components/PlaceholderPage';

export default function InboxPage() {
  return (
    <PlaceholderPage title="Inbox">
      Bulletins for your district will arrive here; you will acknowledge them and file field reports on the
      storms you saw.
    </PlaceholderPage>
  );
}
