// What the palette-route screens show: plain shapes shared by the server module and the islands (no server code here).
import type { RouteSetStatus } from '@db/models/palette-routes';

export type { RouteSetStatus } from '@db/models/palette-routes';

export interface RouteSwatch {
  id: string;
  name: string;
  hex: string;
  role: string | null;
}

/** The level a text/ground pair reaches under WCAG 2.2 (SC 1.4.3 AA 4.5:1, 3:1 for large text; SC 1.4.6 AAA 7:1). */
export type ContrastVerdict = 'AAA' | 'AA' | 'AA large' | 'fails';

export interface RoutePair {
  text: string;
  ground: string;
  ratio: number;
  /** The ratio as people read it, rounded down to two decimals so 4.499 never shows as 4.5. */
  shown: string;
  verdict: ContrastVerdict;
}

/** What each verdict lets a pair carry, in our words. */
export const VERDICT_WORDS: Record<ContrastVerdict, string> = {
  AAA: 'AAA: any text size',
  AA: 'AA: body text',
  'AA large': 'AA for large text only',
  fails: 'Below AA: decoration only',
};

export interface RouteColorView extends RouteSwatch {
  value: string;
}

export interface RouteView {
  id: string;
  position: number;
  name: string;
  rationale: string;
  colors: RouteColorView[];
  contrast: RoutePair[];
  clientComment: string | null;
}

export interface RouteSetDecision {
  by: string;
  at: string;
  chosenRouteId: string | null;
  comment: string;
}

export interface RouteSetView {
  id: string;
  title: string;
  intro: string;
  status: RouteSetStatus;
  contactName: string | null;
  contactEmail: string | null;
  sentAt: string | null;
  expiresAt: string | null;
  appliedAt: string | null;
  createdBy: string | null;
  routes: RouteView[];
  decision: RouteSetDecision | null;
}

export interface PublicRouteSet {
  brandName: string;
  title: string;
  intro: string;
  status: RouteSetStatus;
  contactName: string | null;
  expiresAt: string | null;
  routes: RouteView[];
  decision: RouteSetDecision | null;
}
