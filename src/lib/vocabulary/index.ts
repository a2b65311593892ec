// Client-safe: Groundwork's words, in one place. Each field's and option's words for the
// customer, the staff and the trade (fields.ts); answers in staff words (answers.ts); the plan's
// and the pack's words (plan.ts, pack.ts); the stages (stages.ts). Pages, islands, the pack, the
// PDF and the e-mails read them from here, so a thing has one name for each audience.
export * from './fields';
export * from './answers';
export * from './plan';
export * from './pack';
export * from './stages';
export * from './readiness';
