import type { CellType, JobFileView, JobState, NotOnsetReason } from '@stormhour/shared';

type TagType = 'gray' | 'blue' | 'green' | 'red' | 'purple' | 'cool-gray';

export const JOB_STATE_TAGS: Record<JobState, { text: string; type: TagType }> = {
  queued: { text: 'Queued', type: 'gray' },
  running: { text: 'Running', type: 'blue' },
  done: { text: 'Done', type: 'green' },
  failed: { text: 'Failed', type: 'red' },
};

export const FILE_STATE_TEXT: Record<JobFileView['state'], string> = {
  waiting: 'Waiting',
  imported: 'Imported',
  skipped: 'Skipped',
  failed: 'Failed',
  duplicate: 'Already imported',
};

/** Said beside the tag, where a tag would cut it short. */
export const FILE_STATE_NOTES: Partial<Record<JobFileView['state'], string>> = {
  duplicate: 'not counted twice',
};

export const FILE_STATE_TAGS: Record<JobFileView['state'], TagType> = {
  waiting: 'gray',
  imported: 'green',
  skipped: 'purple',
  failed: 'red',
  duplicate: 'cool-gray',
};

/** Why a track's first scan is not counted as an onset (DESIGN §3.2). */
export const NOT_ONSET_TEXT: Record<NotOnsetReason, string> = {
  split: 'Split from another track',
  'data-start': 'At the start of the data',
  'after-gap': 'After a gap in the data',
  'edge-band': 'At the edge of coverage',
};

/** Echo-top classes after Johnson et al. (1999). */
export const CELL_TYPE_TEXT: Record<CellType, string> = {
  shallow: 'Shallow cumulus',
  congestus: 'Congestus',
  deep: 'Deep convection',
};
