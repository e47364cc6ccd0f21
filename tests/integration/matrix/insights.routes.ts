// Insights for the brand owner: the report and its CSV export (read only).
import { only, withoutClientWork, type Route } from './route';

const b = (f: { brandId: string }) => `/api/brands/${f.brandId}`;

export default withoutClientWork([
  { method: 'GET', file: 'brands/[id]/insights.ts', path: (f) => `${b(f)}/insights?range=4w`, expect: only(200, ['owner']) },
  { method: 'GET', file: 'brands/[id]/insights.csv.ts', path: (f) => `${b(f)}/insights.csv?range=12m&what=downloads`, expect: only(200, ['owner']) },
] satisfies Route[]);
