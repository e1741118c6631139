import { Tag } from '@carbon/react';
import type { JobState } from '@stormhour/shared';
import { JOB_STATE_TAGS } from '../../intakeWords';

export function JobStateTag({ state }: { state: JobState }) {
  const tag = JOB_STATE_TAGS[state];
  return (
    <Tag type={tag.type} size="sm">
      {tag.text}
    </Tag>
  );
}
