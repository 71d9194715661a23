export { diffRevisions } from './revision-diff.js';
export type { RevisionSide } from './revision-diff.js';
export type { RevisionChangeRow, CompareField, FieldValue } from './compare-types.js';
export { channelStageFields } from './channel-fields.js';
export { MARGIN_FIELDS } from './margin-fields.js';
export { formatField } from './format-field.js';
export type { StudyHeadlines } from './study-headlines.js';
export { studyHeadlines } from './study-headlines-of.js';
