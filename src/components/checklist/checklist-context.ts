// What every field needs from the checklist around it: the form, and the way to queue a save.
import { createContext, useContext } from 'react';
import type { UseFormReturn } from 'react-hook-form';
import type { FormValues } from './form-values';

export type ChecklistContext = {
  form: UseFormReturn<FormValues>;
  /** Dotted paths showing a detail from the invitation that the customer has not confirmed. */
  prefilled?: ReadonlySet<string>;
  /** Questions answered before this step opened: their help starts folded. */
  helpRead?: ReadonlySet<string>;
  /** Confirms these details from the invitation (one step's). */
  confirmDetails?(paths: string[]): Promise<void>;
  confirming?: boolean;
  /**
   * False in the server's drawing and until the island has hydrated. Fields can be typed in
   * before then (early-answers.ts); a control whose state lives only in the island waits.
   */
  hydrated?: boolean;
  /** Queues a field's new value: `soon` while typing, `now` for a choice or on leaving a field. */
  edit(path: string, value: string, when: 'soon' | 'now'): void;
};

export const ChecklistCtx = createContext<ChecklistContext | null>(null);

/** The surrounding checklist; fields only ever render inside one. */
export function useChecklist(): ChecklistContext {
  const ctx = useContext(ChecklistCtx);
  if (!ctx) throw new Error('Checklist fields must sit inside <ChecklistCtx.Provider>.');
  return ctx;
}

/** A stable element id for a dotted path. @example fieldId('supply.mpanCore') // 'f-supply-mpanCore' */
export function fieldId(path: string): string {
  return `f-${path.replace(/\./g, '-')}`;
}
