// The check before publishing, fed from the database: the working draft, the identity and the brand's shelf.
import { Asset, type Brand } from '@db/models';
import { allTemplateInstructions, readDraft } from '@/lib/guideline/draft.server';
import { loadIdentity } from '@/lib/identity/identity.server';
import { preflight, type Finding, type ShelfEntry } from './preflight';

/** What a reader of the next version would receive that the designer should look at first. */
export async function preflightBrand(brand: Brand): Promise<Finding[]> {
  const [draft, identity, assets, instructions] = await Promise.all([
    readDraft(brand),
    loadIdentity(brand),
    Asset.findAll({ where: { brandId: brand.id }, attributes: ['id', 'name', 'state', 'altText'] }),
    allTemplateInstructions(),
  ]);
  const shelf = new Map<string, ShelfEntry>(assets.map((a) => [a.id, { name: a.name, state: a.state, alt: a.altText }]));
  return preflight({ doc: draft.doc, identity, shelf, instructions });
}
