// The office queue names open checks by their short staff names, matched on the titles the
// queue API lists. The titles now come from a small module of their own; this runs the real
// engine (not that module) and checks that every title it gives is recognised.
import { describe, expect, it } from 'vitest';
import { runChecks } from '@/lib/readiness';
import { checkShortNames, shortCheckName } from '@/components/office/check-names';

describe('shortCheckName', () => {
  it('knows the title of every check the engine runs', () => {
    const { checks } = runChecks({ today: '2025-01-01' });
    expect(checks.length).toBe(Object.keys(checkShortNames).length);
    for (const check of checks) expect(shortCheckName(check.title)).toBe(checkShortNames[check.id]);
  });
  it('gives back a title it does not know', () => {
    expect(shortCheckName('A check from a later version')).toBe('A check from a later version');
  });
});
