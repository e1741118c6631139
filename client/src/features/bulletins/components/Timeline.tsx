import { Tag } from '@carbon/react';
import { BULLETIN_STATE_LABELS, type BulletinEventView, type BulletinTransition } from '@stormhour/shared';
import { formatDateTime } from '../../../lib/format';
import { STATE_TAG } from '../bulletinWords';

const VERBS: Record<BulletinTransition, string> = {
  create: 'Drafted',
  submit: 'Submitted for review',
  approve: 'Approved',
  return: 'Returned to the writer',
  send: 'Sent to the officers',
  withdraw: 'Withdrawn',
};

/** Every step the bulletin took, oldest first: what, who, when, and the comment given. */
export function Timeline({ events }: { events: BulletinEventView[] }) {
  if (events.length === 0) return <p>No steps yet.</p>;
  return (
    <ol className="bulletin-timeline" aria-label="History">
      {events.map((e, i) => (
        // biome-ignore lint/suspicious/noArrayIndexKey: events are an append-only list in order
        <li key={i} className="bulletin-timeline__event">
          <div className="bulletin-timeline__what">
            <strong>{VERBS[e.transition]}</strong>{' '}
            <Tag size="sm" type={STATE_TAG[e.to]}>
              {BULLETIN_STATE_LABELS[e.to]}
            </Tag>
          </div>
          <div className="bulletin-timeline__who">
            by {e.actor}, <time dateTime={e.at}>{formatDateTime(e.at)}</time>
          </div>
          {e.comment ? <blockquote className="bulletin-timeline__comment">{e.comment}</blockquote> : null}
        </li>
      ))}
    </ol>
  );
}
