/**
 * The one typed map of the desktop shell's IPC surface: for every channel, the zod
 * schema its arguments must pass in main, and the result type it answers with.
 * Main validates with these schemas; the preload and the renderer take their types
 * from here (`import type { LegwiseApi } from '../electron/contract'`), so no
 * hand-kept twin of the API exists anywhere.
 *
 * Every result is an `Outcome`: `{ ok: true, ... }` or `{ ok: false, code, message }`,
 * so errors cross IPC as data, never as thrown exceptions with stacks.
 */
import { z } from 'zod';
import { PlanSchema, type Plan } from '../core/plan/schema.ts';
import type { PlanIssue } from '../core/plan/load.ts';
import type { InvokeMethod, MenuCommand } from './channels.ts';

export type { InvokeMethod, MenuCommand } from './channels.ts';

export type ErrorCode =
  | 'BAD_ARGS' // arguments failed the channel's schema
  | 'UNKNOWN_CHANNEL' // no such channel in this contract
  | 'FORBIDDEN' // the request did not come from our own page
  | 'CANCELLED' // the person closed a dialog or declined to discard changes
  | 'NOT_FOUND' // a recent file no longer exists
  | 'READ_FAILED' // the file could not be read
  | 'INVALID_PLAN' // the file was read but is not a valid plan (see `issues`)
  | 'WRITE_FAILED' // the file could not be written; the previous copy is intact
  | 'INTERNAL'; // anything else; the message says what

export interface Failure {
  ok: false;
  code: ErrorCode;
  message: string;
  /** For INVALID_PLAN: the loader's messages, each naming the JSON path. */
  issues?: PlanIssue[];
}

export type Outcome<T extends object = object> = ({ ok: true } & T) | Failure;

export interface OpenedPlan {
  plan: Plan;
  warnings: string[];
  /** What updating an older plan file changed, in plain words (empty for a current file). */
  changes?: string[];
  filePath: string;
}
export interface SavedFile {
  filePath: string;
  /**
   * Set when the file had been changed by another program and the person chose to
   * reload it instead of saving: the page shows this plan (nothing was written).
   */
  reloaded?: OpenedPlan;
}
export interface RecentFile {
  filePath: string;
  /** File name without folders, for menus and lists. */
  name: string;
}
export interface RecoveredPlan {
  plan: Plan;
  warnings: string[];
  /** The file the autosaved plan came from, or null for a plan never saved. */
  sourcePath: string | null;
}

/** Limits keep a misbehaving page from pushing huge strings through IPC. */
const filePathArg = z.string().min(1).max(4096);
const suggestedName = z.string().max(200);
/** Longest CSV or GPX text accepted (characters): far above any real plan's table or route. */
const MAX_TEXT_CHARS = 20_000_000;
const textExport = z.tuple([z.object({ text: z.string().max(MAX_TEXT_CHARS), suggestedName })]);

/** Carries the result type of a channel beside its argument schema. */
export interface Channel<A extends z.ZodType<readonly unknown[]>, R> {
  readonly args: A;
  /** Type-level only; never set at run time. */
  readonly result?: R;
}
const channel =
  <R>() =>
  <A extends z.ZodType<readonly unknown[]>>(args: A): Channel<A, R> => ({ args });

export const contract = {
  /** Start a new plan: asks first if there are unsaved changes. */
  newPlan: channel<Outcome>()(z.tuple([])),
  /** Open dialog → validated plan. A bad file changes nothing and returns INVALID_PLAN. */
  openPlan: channel<Outcome<OpenedPlan>>()(z.tuple([])),
  openRecent: channel<Outcome<OpenedPlan>>()(z.tuple([filePathArg])),
  /** Save to the current file (or ask where, for a plan never saved). */
  savePlan: channel<Outcome<SavedFile>>()(z.tuple([PlanSchema])),
  savePlanAs: channel<Outcome<SavedFile>>()(z.tuple([PlanSchema])),
  listRecent: channel<Outcome<{ files: RecentFile[] }>>()(z.tuple([])),
  /** The page reports unsaved changes and the plan name (window title, close prompt). */
  setDirty: channel<Outcome>()(
    z.tuple([z.object({ dirty: z.boolean(), name: z.string().max(200) })]),
  ),
  /** Crash insurance: the current plan, sent every few seconds while dirty. */
  autosave: channel<Outcome>()(z.tuple([PlanSchema])),
  /** The plan autosaved by a session that did not end cleanly, or null. Reads only. */
  recoverAutosave: channel<Outcome<{ recovered: RecoveredPlan | null }>>()(z.tuple([])),
  discardAutosave: channel<Outcome>()(z.tuple([])),
  /** Print the current page (its print styles) to PDF and save it where the person chooses. */
  exportPdf: channel<Outcome<SavedFile>>()(z.tuple([z.object({ suggestedName })])),
  /** Save CSV text the page produced. */
  exportCsv: channel<Outcome<SavedFile>>()(textExport),
  /** Save the route as GPX text the page produced. */
  exportGpx: channel<Outcome<SavedFile>>()(textExport),
  /** Print the current page (its print styles) with the system's print dialog. */
  printReport: channel<Outcome>()(z.tuple([])),
  /**
   * Open the file the operating system handed the shell (double-click, command line,
   * second instance). No path argument: the page can only take what the OS offered.
   */
  openOffered: channel<Outcome<OpenedPlan>>()(z.tuple([])),
} satisfies { [K in InvokeMethod]: Channel<z.ZodType<readonly unknown[]>, unknown> };

export type Contract = typeof contract;
/** Arguments as the page passes them (zod input types). */
export type InvokeArgs<K extends InvokeMethod> = z.input<Contract[K]['args']>;
/** Arguments as main's handlers receive them after validation. */
export type ValidArgs<K extends InvokeMethod> = z.output<Contract[K]['args']>;
export type InvokeResult<K extends InvokeMethod> = NonNullable<Contract[K]['result']>;

/** What `window.legwise` offers the renderer. */
export type LegwiseApi = {
  [K in InvokeMethod]: (...args: InvokeArgs<K>) => Promise<InvokeResult<K>>;
} & {
  /** Subscribe to menu commands and shortcuts; returns an unsubscribe function. */
  onMenuCommand(callback: (command: MenuCommand) => void): () => void;
};

/** Main's side: one handler per channel, receiving validated arguments. */
export type Handlers = {
  [K in InvokeMethod]: (...args: ValidArgs<K>) => Promise<InvokeResult<K>>;
};

export function failure(code: ErrorCode, message: string, issues?: PlanIssue[]): Failure {
  return issues ? { ok: false, code, message, issues } : { ok: false, code, message };
}
