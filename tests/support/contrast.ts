/**
 * WCAG 2.x relative luminance of an sRGB colour written `#RRGGBB` (WCAG 2.1, "relative luminance",
 * https://www.w3.org/TR/WCAG21/#dfn-relative-luminance). WCAG 2.1 prints the linear threshold as
 * 0.03928, the sRGB standard (IEC 61966-2-1) and WCAG 2.2 as 0.04045; no 8-bit value lies between.
 */
export function relativeLuminance(hex: string): number {
  const value = Number.parseInt(hex.replace('#', ''), 16);
  const linear = (channel: number) => {
    const c = channel / 255;
    return c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
  };
  return 0.2126 * linear((value >> 16) & 255) + 0.7152 * linear((value >> 8) & 255) + 0.0722 * linear(value & 255);
}

/** (L1 + 0.05) / (L2 + 0.05), the lighter colour's luminance over the darker's (WCAG 2.1, "contrast ratio"). */
export function contrastRatio(a: string, b: string): number {
  const [lighter, darker] = [relativeLuminance(a), relativeLuminance(b)].sort((x, y) => y - x) as [number, number];
  return (lighter + 0.05) / (darker + 0.05);
}
