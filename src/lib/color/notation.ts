// How a colour's values are written out for readers: one place, so the palette block and the search index agree.

/** "C 0 M 62 Y 80 K 14": the way printers read CMYK percentages. */
export const formatCmyk = ([c, m, y, k]: readonly number[]) => `C ${c} M ${m} Y ${y} K ${k}`;

/** CSS Color 4's space-separated rgb(), e.g. "rgb(29 42 68)". */
export const formatRgb = ([r, g, b]: readonly number[]) => `rgb(${r} ${g} ${b})`;
