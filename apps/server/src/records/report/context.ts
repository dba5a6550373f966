import type { RecordData } from '../record-data.ts';
import { fmtTime, knownZone } from '../format.ts';

/** What every section of a report reads: the record, and how to print its times. */
export interface ReportContext {
  data: RecordData;
  /** The organization's time zone (UTC when the runtime does not know it). */
  zone: string;
  /** A stored UTC time in the organization's zone with its offset. */
  time(at: string): string;
}

export function reportContext(data: RecordData): ReportContext {
  const zone = knownZone(data.org.timezone);
  return { data, zone, time: (at) => fmtTime(at, zone) };
}
