// The autosave queue on its own, with a scripted transport standing in for the network: the
// sequences a phone meets. Each expected outcome follows from the contract stated in
// autosave-queue.ts ("only forgotten once the server has that exact value"), not from its code.
import { describe, expect, it } from 'vitest';
import { AutosaveQueue, type QueueListener, type SaveStatus } from '@/components/checklist/autosave-queue';
import type { CaseView, PatchOutcome } from '@/components/checklist/api-client';

const view = (version: number, checklist: Record<string, unknown> = {}): CaseView =>
  ({ id: 'c1', reference: 'GW-TEST', stage: 'filling_in', version, checklist, progress: [], warnings: {}, region: null, editable: true, updatedAt: '' }) as CaseView;

function harness(script: Array<(patch: unknown, version: number) => PatchOutcome>) {
  const sent: Array<{ patch: unknown; version: number }> = [];
  const statuses: SaveStatus['kind'][] = [];
  const listener: QueueListener = {
    status: (s) => statuses.push(s.kind),
    saved: () => {},
    conflict: () => {},
    invalid: () => {},
    locked: () => {},
  };
  const queue = new AutosaveQueue({
    caseId: 'c1',
    version: 1,
    storage: null,
    debounceMs: 0,
    listener,
    transport: async (patch, version) => {
      sent.push({ patch, version });
      const step = script.shift();
      if (!step) throw new Error('no more scripted answers');
      return step(patch, version);
    },
  });
  return { queue, sent, statuses };
}

const until = async (ok: () => boolean, ms = 5000) => {
  const end = Date.now() + ms;
  while (!ok()) {
    if (Date.now() > end) throw new Error('condition not met in time');
    await new Promise((r) => setTimeout(r, 20));
  }
};

describe('AutosaveQueue', () => {
  it('a save that landed but whose answer was lost: retries, meets the 409, resends with the new version', async () => {
    const { queue, sent } = harness([
      () => ({ kind: 'failed' }), // the server saved version 2, the phone never heard
      () => ({ kind: 'conflict', current: view(2, { parking: { kind: 'garage' } }) }),
      () => ({ kind: 'saved', view: view(2, { parking: { kind: 'garage' } }) }),
    ]);
    queue.edit('parking.kind', 'garage', 'now');
    // The first retry waits out a 1 s backoff.
    await until(() => Object.keys(queue.pending()).length === 0);
    expect(sent.map((s) => s.version)).toEqual([1, 1, 2]);
    queue.dispose();
  }, 10_000);

  it('a 503 (failed) keeps the edit and retries; nothing is forgotten until a save succeeds', async () => {
    const { queue, sent, statuses } = harness([
      () => ({ kind: 'failed' }),
      () => ({ kind: 'failed' }),
      () => ({ kind: 'saved', view: view(2, { parking: { kind: 'garage' } }) }),
    ]);
    queue.edit('parking.kind', 'garage', 'now');
    await until(() => sent.length >= 1);
    expect(queue.pending()).toEqual({ 'parking.kind': 'garage' });
    await until(() => Object.keys(queue.pending()).length === 0, 8000);
    expect(sent).toHaveLength(3);
    expect(statuses).toContain('retrying');
    expect(statuses.at(-1)).toBe('saved');
    queue.dispose();
  }, 10_000);
});
