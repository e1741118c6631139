import { PlaceholderPage } from '../../components/PlaceholderPage';

export default function BulletinsPage() {
  return (
    <PlaceholderPage title="Bulletins">
      Weekly district bulletins will be drafted, reviewed, approved and sent from here.
    </PlaceholderPage>
  );
}
