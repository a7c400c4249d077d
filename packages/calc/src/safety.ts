/**
 * Shown with every result that recommends a conductor, a fuse or a battery (DESIGN.md, Safety).
 */
export const SAFETY_CAUTION =
  "These results are estimates. Follow the component makers' instructions, local codes and a qualified installer's judgement: wiring and batteries can burn a vehicle and hurt people.";
