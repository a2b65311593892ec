// The cautions that stand beside the readiness results wherever they are shown; their words
// live with every other caution in src/lib/cautions.ts.
export { readinessCautions } from '@/lib/cautions';
