// What a user reads for each segment field: in forms, errors and the table.
export { SEGMENT_FIELD_LABELS } from '@shared/field-labels';
