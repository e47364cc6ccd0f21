// Build step: the version's design tokens in every format the token API offers (DTCG JSON and its hex form, CSS,
// SCSS, Tailwind), made from the identity frozen in the version, so a download never changes after publishing.
import { tokensInput } from '@/lib/identity/identity.server';
import { log } from '@/lib/log.server';
import { TokenError, tokenFile, TOKEN_FORMATS } from '@/lib/tokens';
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
    const refused: string[] = [];
    for (const format of TOKEN_FORMATS) {
      let file;
      try {
        file = tokenFile(format, tokens);
      } catch (err) {
        // A value the exporters refuse (e.g. an old row past today's rules) leaves that file out, not the version:
        // its token address says so, and the rest of the version is published.
        if (!(err instanceof TokenError)) throw err;
        refused.push(`${format}: ${err.message}`);
        continue;
      }
      await ctx.writer.write(tokenPath(format), new TextEncoder().encode(file.body), file.contentType);
      await ctx.progress(++written);
    }
    if (refused.length) {
      ctx.note(`Some token files were left out: ${refused.join(' ')}`.slice(0, 600));
      log.warn({ versionId: ctx.versionId, refused }, 'build: token files left out');
    }
  },
};
