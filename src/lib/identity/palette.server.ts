// The brand's palette as the screens and the palette report read it: id, name and stored hex, in the designer's order.
import { BrandColor } from '@db/models';

export interface PaletteEntry {
  id: string;
  name: string;
  hex: string;
}

/** Every colour of the brand, in palette order. */
export async function brandPalette(brandId: string): Promise<PaletteEntry[]> {
  const rows = await BrandColor.findAll({ where: { brandId }, order: [['position', 'ASC']], attributes: ['id', 'name', 'hex'] });
  return rows.map((c) => ({ id: c.id, name: c.name, hex: c.hex }));
}
