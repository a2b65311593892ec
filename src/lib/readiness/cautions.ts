// The cautions that stand beside the readiness results wherever they are shown.

/**
 * Plain-words cautions for the customer and the pack (from the trade reference's cautions).
 *
 * @example readinessCautions.length // 3
 */
export const readinessCautions: readonly string[] = Object.freeze([
  'Never open the cut-out, the meter or the consumer unit, or remove covers: photos only.',
  'Only the network operator (or its agent) may change the main fuse or the cut-out.',
  'These checks help prepare for the survey; they are not a design. The installation is designed, installed and certified by a qualified electrician under BS 7671, the IET Code of Practice for EV Charging Equipment Installation, and local building and planning rules.',
]);
