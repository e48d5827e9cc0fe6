import type { ColumnMap } from '../../../../shared/log/column-map';
import type { ColumnMapNeeded } from '../../../lib/log-pipeline/pipeline';

/** What the engine said about a file it could not read, as the job row shows it. */
export interface ImportProblem {
  code: string;
  message: string;
  line?: number;
  column?: number;
  header?: string;
}

export type JobStatus =
  | { kind: 'queued' }
  | { kind: 'reading'; bytes: number; rows: number }
  | { kind: 'analysing'; rows: number }
  | ColumnMapNeeded
  | { kind: 'failed'; problem: ImportProblem; canMap: boolean }
  | { kind: 'cancelled' }
  | { kind: 'done'; flightId: string; findings: number; worst: 'note' | 'watch' | 'act' | null };

export interface ImportJob {
  id: string;
  file: File;
  status: JobStatus;
  /** Column map confirmed by the person for this file, used on the next read. */
  columnMap?: ColumnMap;
  /** Motor pole count for eRPM columns, asked for when the engine needs it. */
  poles?: number;
}

export type JobAction =
  | { type: 'add'; items: { id: string; file: File }[] }
  | { type: 'status'; id: string; status: JobStatus }
  | { type: 'map'; id: string; columnMap: ColumnMap }
  | { type: 'retry'; id: string }
  | { type: 'remove'; id: string };

const accepted = /\.(csv|csv\.gz|txt)$/i;

export function isLogFile(file: File): boolean {
  return accepted.test(file.name);
}

/** The list of files on the import page; each file moves queued → reading → analysing → done. */
export function jobsReducer(jobs: ImportJob[], action: JobAction): ImportJob[] {
  switch (action.type) {
    case 'add':
      return [
        ...jobs,
        ...action.items.map(({ id, file }) => ({ id, file, status: { kind: 'queued' } as const })),
      ];
    case 'status':
      return jobs.map((j) => (j.id === action.id ? { ...j, status: action.status } : j));
    case 'map':
      return jobs.map((j) =>
        j.id === action.id
          ? { ...j, columnMap: action.columnMap, status: { kind: 'queued' } as const }
          : j,
      );
    case 'retry':
      return jobs.map((j) =>
        j.id === action.id ? { ...j, status: { kind: 'queued' } as const } : j,
      );
    case 'remove':
      return jobs.filter((j) => j.id !== action.id);
  }
}

/** The job the runner should start next: one at a time, so two big logs never share the memory. */
export function nextQueued(jobs: ImportJob[]): ImportJob | undefined {
  if (jobs.some((j) => j.status.kind === 'reading' || j.status.kind === 'analysing'))
    return undefined;
  return jobs.find((j) => j.status.kind === 'queued');
}
