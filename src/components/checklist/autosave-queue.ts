// Autosave without lost words: every edit is written to localStorage at once, sent to the
// server shortly after, and only forgotten once the server has that exact value.
import type { CaseView, PatchOutcome } from './api-client';
import { checkFormValue, editsToPatch, type Edits } from './form-values';
import type { ChecklistPatchInput } from '@/lib/schemas/checklist';

export type SaveStatus =
  | { kind: 'idle' }
  | { kind: 'pending' }
  | { kind: 'saving' }
  | { kind: 'saved' }
  | { kind: 'retrying'; offline: boolean }
  | { kind: 'invalid'; paths: string[] }
  | { kind: 'signed-out' }
  | { kind: 'locked'; message: string };

export type QueueListener = {
  status(status: SaveStatus): void;
  /** The server now holds these paths' values; `view` is the saved case. */
  saved(view: CaseView, paths: string[]): void;
  /** Someone else saved first; `kept` are the paths whose local edits still win. */
  conflict(current: CaseView, kept: string[]): void;
  /** The server refused these values; they stay local until the customer changes them. */
  invalid(fields: Record<string, string>): void;
  locked(message: string): void;
};

export type Transport = (patch: ChecklistPatchInput, version: number) => Promise<PatchOutcome>;

type Options = {
  caseId: string;
  version: number;
  transport: Transport;
  listener: QueueListener;
  storage?: Storage | null;
  debounceMs?: number;
};

const MAX_BACKOFF_MS = 30_000;
// After this many conflicts in a row, something else keeps saving: slow down like a failure.
const MAX_QUICK_CONFLICTS = 3;

/**
 * The localStorage key prefix for a case's unsaved edits; each tab writes its own key under it,
 * so two tabs never overwrite each other's unsaved words.
 *
 * @example storagePrefix('c1') // 'groundwork:checklist:c1:'
 */
export function storagePrefix(caseId: string): string {
  return `groundwork:checklist:${caseId}:`;
}

type Stored = { edits: Edits; at: string };

/**
 * Queues a case's edits and saves them with PATCH + If-Match, retrying with backoff.
 *
 * @example
 * const queue = new AutosaveQueue({ caseId, version: view.version, transport, listener });
 * queue.edit('about.town', 'Quillbury'); // saved about 800 ms later
 */
export class AutosaveQueue {
  version: number;
  private edits: Edits = {};
  private held = new Map<string, string>();
  private timer: ReturnType<typeof setTimeout> | undefined;
  private inFlight: Promise<void> | null = null;
  private paused = false;
  private failures = 0;
  private conflicts = 0;
  private stopped = false;
  private lastStatus = '';
  private readonly debounceMs: number;
  private readonly storage: Storage | null;
  private readonly key: string;

  constructor(private readonly options: Options) {
    this.version = options.version;
    this.debounceMs = options.debounceMs ?? 800;
    this.storage = options.storage === undefined ? safeLocalStorage() : options.storage;
    this.key = `${storagePrefix(options.caseId)}${Math.random().toString(36).slice(2, 10)}`;
  }

  /** Edits kept from an earlier visit (a closed tab, a lost signal); this tab takes them over. */
  restore(): Edits {
    const found = this.adoptStored();
    this.edits = { ...found, ...this.edits };
    this.write();
    return found;
  }

  /** The edits the server does not have yet. */
  pending(): Edits {
    return { ...this.edits };
  }

  /** True while a save is on its way to the server. */
  busy(): boolean {
    return this.inFlight !== null;
  }

  has(path: string): boolean {
    return path in this.edits;
  }

  /** Records an edit now and saves it soon (typing) or at once (a choice, leaving a field). */
  edit(path: string, value: string, when: 'soon' | 'now' = 'soon') {
    if (this.stopped) return;
    this.paused = false;
    this.edits[path] = value;
    this.write();
    this.schedule(when === 'now' ? 0 : this.debounceMs);
    this.emit(this.inFlight ? { kind: 'saving' } : { kind: 'pending' });
  }

  /** Sends what can be sent; keeps going while saves succeed and more is waiting. */
  async flush(): Promise<void> {
    clearTimeout(this.timer);
    if (this.stopped || this.paused) return;
    if (this.inFlight) return this.inFlight;
    const batch = this.sendable();
    if (Object.keys(batch).length === 0) return this.settle();
    this.emit({ kind: 'saving' });
    this.inFlight = this.send(batch);
    try {
      await this.inFlight;
    } finally {
      this.inFlight = null;
    }
    // After a failure the backoff timer takes over; otherwise send what was typed meanwhile.
    if (this.failures === 0) return this.flush();
  }

  /** True when every edit is on the server, after trying to send what is left. */
  async saveAll(): Promise<boolean> {
    for (let round = 0; round < 10; round++) {
      await this.flush();
      if (this.inFlight) await this.inFlight;
      if (this.failures > 0 || this.stopped || this.paused || Object.keys(this.sendable()).length === 0) break;
    }
    return Object.keys(this.edits).length === 0;
  }

  /** Edits that cannot be sent as they stand, with the reason for each. */
  blocked(): Record<string, string> {
    const out: Record<string, string> = {};
    for (const [path, value] of Object.entries(this.edits)) {
      const check = checkFormValue(path, value);
      if (!check.ok) out[path] = check.message;
      else if (this.held.get(path) === value) out[path] = 'The server could not save this answer.';
    }
    return out;
  }

  /** Tries again at once, e.g. when the browser comes back online. */
  retryNow() {
    this.paused = false;
    if (this.failures > 0 || Object.keys(this.sendable()).length > 0) void this.flush();
  }

  dispose() {
    this.stopped = true;
    clearTimeout(this.timer);
  }

  // ---- internals --------------------------------------------------------------------------

  private sendable(): Edits {
    const out: Edits = {};
    for (const [path, value] of Object.entries(this.edits)) {
      if (this.held.get(path) === value) continue;
      if (checkFormValue(path, value).ok) out[path] = value;
    }
    return out;
  }

  private async send(batch: Edits) {
    const outcome = await this.options.transport(editsToPatch(batch), this.version).catch((): PatchOutcome => ({ kind: 'failed' }));
    switch (outcome.kind) {
      case 'saved':
        return this.onSaved(outcome.view, batch);
      case 'invalid':
        return this.onInvalid(outcome.fields, batch);
      case 'conflict':
        return this.onConflict(outcome.current);
      case 'locked':
        return this.onLocked(outcome.message);
      case 'signed-out':
        // Waits for the next edit (after signing in again) rather than asking again and again.
        this.paused = true;
        return this.emit({ kind: 'signed-out' });
      case 'failed':
        return this.onFailed();
    }
  }

  private onSaved(view: CaseView, batch: Edits) {
    this.version = view.version;
    this.failures = 0;
    this.conflicts = 0;
    // Forget only values the server now has; anything typed since stays queued.
    const saved = Object.keys(batch).filter((path) => this.edits[path] === batch[path]);
    for (const path of saved) {
      delete this.edits[path];
      this.held.delete(path);
    }
    this.write();
    this.options.listener.saved(view, saved);
  }

  private onInvalid(fields: Record<string, string>, batch: Edits) {
    this.failures = 0;
    const named = Object.keys(batch).filter((path) => path in fields);
    // If the server named nothing we sent, hold the whole batch rather than loop on it.
    for (const path of named.length > 0 ? named : Object.keys(batch)) this.held.set(path, batch[path]!);
    this.options.listener.invalid(fields);
  }

  private onConflict(current: CaseView) {
    this.version = current.version;
    // The server answered, so the link works: go on at once with the new version. (Left at its
    // count, a failure before the conflict — a save that landed but whose answer was lost —
    // stopped the queue here with the edit unsent and no retry scheduled.)
    this.failures = 0;
    this.conflicts += 1;
    this.options.listener.conflict(current, Object.keys(this.edits));
    if (this.conflicts >= MAX_QUICK_CONFLICTS) this.onFailed();
  }

  private onLocked(message: string) {
    this.stopped = true;
    this.edits = {};
    this.write();
    this.emit({ kind: 'locked', message });
    this.options.listener.locked(message);
  }

  private onFailed() {
    this.failures += 1;
    const delay = Math.min(MAX_BACKOFF_MS, 1000 * 2 ** (this.failures - 1));
    this.emit({ kind: 'retrying', offline: typeof navigator !== 'undefined' && navigator.onLine === false });
    this.schedule(delay);
  }

  private settle() {
    if (this.failures > 0) return;
    const blocked = Object.keys(this.blocked());
    if (blocked.length > 0) this.emit({ kind: 'invalid', paths: blocked });
    else if (this.lastStatus !== '') this.emit({ kind: 'saved' });
  }

  private schedule(ms: number) {
    clearTimeout(this.timer);
    this.timer = setTimeout(() => void this.flush(), ms);
  }

  private emit(status: SaveStatus) {
    const key = JSON.stringify(status);
    if (key === this.lastStatus) return;
    this.lastStatus = key;
    this.options.listener.status(status);
  }

  // Every stored set of edits for this case, oldest first so newer words win; the keys are
  // removed, as this tab now holds the edits (a tab still open writes its own key again).
  private adoptStored(): Edits {
    const prefix = storagePrefix(this.options.caseId);
    const found: (Stored & { key: string })[] = [];
    try {
      for (let i = 0; i < (this.storage?.length ?? 0); i++) {
        const key = this.storage!.key(i);
        if (key?.startsWith(prefix) && key !== this.key) found.push({ ...parseStored(this.storage!.getItem(key)), key });
      }
      for (const item of found) this.storage!.removeItem(item.key);
    } catch {
      return {};
    }
    found.sort((a, b) => a.at.localeCompare(b.at));
    return Object.assign({}, ...found.map((item) => item.edits)) as Edits;
  }

  private write() {
    try {
      if (Object.keys(this.edits).length === 0) this.storage?.removeItem(this.key);
      else this.storage?.setItem(this.key, JSON.stringify({ edits: this.edits, at: new Date().toISOString() } satisfies Stored));
    } catch {
      // Private browsing or a full disk: the edit still goes to the server, just not kept locally.
    }
  }
}

// Anything unreadable counts as no edits rather than breaking the page.
function parseStored(raw: string | null): Stored {
  try {
    const parsed = raw ? (JSON.parse(raw) as Partial<Stored>) : {};
    const edits = typeof parsed.edits === 'object' && parsed.edits !== null ? parsed.edits : {};
    const strings = Object.entries(edits).filter((entry): entry is [string, string] => typeof entry[1] === 'string');
    return { edits: Object.fromEntries(strings), at: typeof parsed.at === 'string' ? parsed.at : '' };
  } catch {
    return { edits: {}, at: '' };
  }
}

// Some browsers throw on touching localStorage at all (blocked storage); then we do without it.
function safeLocalStorage(): Storage | null {
  try {
    return typeof window !== 'undefined' ? window.localStorage : null;
  } catch {
    return null;
  }
}
