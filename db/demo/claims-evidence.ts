/** A file the demo puts on a claim when its evidence is made ready: the shop's inspection sheet, or a photo of the unit. */
export type DemoEvidenceKind = 'sheet' | 'photo';

/**
 * The files of a demo claim, by its number at its shop: every claim gets an inspection sheet, and
 * one in ten (the shop's first among them) a photo as well, since photos take a while to draw.
 * The request to the vendor names as many files, so both sides read it from here.
 */
export function demoEvidenceKinds(sequence: number): DemoEvidenceKind[] {
  return sequence % 10 === 1 ? ['photo', 'sheet'] : ['sheet'];
}
