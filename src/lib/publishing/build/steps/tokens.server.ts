// Build step: the version's design tokens in every format the token API offers (DTCG JSON and its hex form, CSS,
// SCSS, Tailwind), made from the identity frozen in the version, so a download never changes after publishing.
import { tokensInput } from '@/lib/identity/identity.server';
import { tokenFile, TOKEN_FORMATS } from '@/lib/tokens';
import { GuidelineVersion } from '@db/models';
import type { Identity } from '@/lib/identity/types';
import { tokenPath, type BuildStepDefinition } from '../contract';

export const tokensStep: BuildStepDefinition = {
  id: 'tokens',
  label: 'Design tokens',
  async run(ctx) {
    const version = await GuidelineVersion.findByPk(ctx.versionId, { attributes: ['snapshot'] });
    if (!version) throw new Error(`version ${ctx.number} is gone`);
    const tokens = tokensInput((version.snapshot as { identity: Identity }).identity);
    let written = 0;
    for (const format of TOKEN_FORMATS) {
      const file = tokenFile(format, tokens);
      await ctx.writer.write(tokenPath(format), new TextEncoder().encode(file.body), file.contentType);
      await ctx.progress(++written);
    }
  },
};
