// Build step "search": one search index per audience that sees a different page (searchPath()), from the same
// frozen document and identity the pages step drew, so a reader finds exactly what their page shows.
import { GuidelineVersion } from '@db/models';
import { searchDocuments, searchIndexJson, SEARCH_AUDIENCES } from '@/lib/publishing/search';
import { versionMaterial } from '@/site/render.server';
import { searchPath, type BuildStepDefinition } from '../contract';

export const searchStep: BuildStepDefinition = {
  id: 'search',
  label: 'Index for search',
  async run(ctx) {
    const version = await GuidelineVersion.findByPk(ctx.versionId);
    if (!version) throw new Error('The version is gone.');
    const { doc, identity } = await versionMaterial(version, ctx.slug);
    let written = 0;
    for (const audience of SEARCH_AUDIENCES) {
      const json = searchIndexJson(searchDocuments(doc, identity, audience));
      await ctx.writer.write(searchPath(audience), Buffer.from(json), 'application/json; charset=utf-8');
      await ctx.progress(++written);
    }
  },
};
