/** What the audit viewer receives: one definition for server and client. */
export interface AuditEventView {
  id: string;
  at: string;
  userId: string | null;
  /** Null for events without a person (none yet), or a member no longer on record. */
  userName: string | null;
  action: string;
  recordType: string;
  recordId: string | null;
  detail: Record<string, unknown>;
}

export interface AuditPage {
  items: AuditEventView[];
  total: number;
  page: number;
  pageSize: number;
}

export interface AuditFilters {
  people: { id: string; name: string; role: string; active: boolean }[];
  recordTypes: string[];
  timeZone: string;
}

/** Words for the record types the trail holds; an unknown type is shown as stored. */
export const recordTypeWords: Record<string, string> = {
  athlete: 'Athlete',
  clinic: 'Clinic settings',
  injury: 'Injury',
  measurement: 'Measurement',
  'session-note': 'Session note',
  run: 'Run',
  sequence: 'Sequence',
  upload: 'Photo',
  user: 'Staff member',
};
