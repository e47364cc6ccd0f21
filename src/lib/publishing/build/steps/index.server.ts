// The build's steps, in the order the build job runs them: files → pages → search → tokens → pdf (the PDF step prints
// the pages an earlier step wrote). Each step writes only through ctx.writer.
import type { BuildStepDefinition } from '../contract';
import { filesStep } from './files.server';
import { pagesStep } from './pages.server';
import { pdfStep } from './pdf.server';
import { searchStep } from './search.server';
import { tokensStep } from './tokens.server';

export const BUILD_STEPS: readonly BuildStepDefinition[] = [filesStep, pagesStep, searchStep, tokensStep, pdfStep];
