// The build's steps, in the order the build job runs them: files → pages → tokens → pdf.
import type { BuildStepDefinition } from '../contract';
import { filesStep } from './files.server';
import { pagesStep } from './pages.server';

export const BUILD_STEPS: readonly BuildStepDefinition[] = [filesStep, pagesStep];
