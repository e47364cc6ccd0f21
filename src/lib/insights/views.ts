// What the insights page and its JSON API show: the view types an island may import (no server code here).
import { z } from 'zod';

export const INSIGHT_RANGES = ['7d', '4w', '12m'] as const;
export type InsightRange = (typeof INSIGHT_RANGES)[number];
export const RANGE_LABELS: Record<InsightRange, { label: string; bucket: 'day' | 'week' | 'month' }> = {
  '7d': { label: 'Last 7 days', bucket: 'day' },
  '4w': { label: 'Last 4 weeks', bucket: 'week' },
  '12m': { label: 'Last 12 months', bucket: 'month' },
};

/** The tables a CSV export can hold (`what=`). */
export const INSIGHT_TABLES = ['timeline', 'versions', 'sections', 'visitors', 'downloads', 'searches'] as const;
export type InsightTable = (typeof INSIGHT_TABLES)[number];

export const insightsQuerySchema = z.strictObject({ range: z.enum(INSIGHT_RANGES).default('4w') });
export const insightsCsvQuerySchema = z.strictObject({ range: z.enum(INSIGHT_RANGES).default('4w'), what: z.enum(INSIGHT_TABLES).default('timeline') });

export interface InsightBucket {
  /** First day of the bucket (UTC), YYYY-MM-DD. */
  start: string;
  /** The bucket in ISO 8601 words: 2026-12-02, 2026-W49 or 2026-12. */
  label: string;
  views: number;
  visitors: number;
  downloads: number;
}

export interface InsightsReport {
  range: InsightRange;
  bucket: 'day' | 'week' | 'month';
  from: string;
  to: string;
  totals: { views: number; visitors: number; downloads: number; emptySearches: number };
  timeline: InsightBucket[];
  versions: { number: number; views: number; visitors: number }[];
  sections: { versionNumber: number; blockId: string; title: string; views: number }[];
  /** Distinct daily visitors by the way they came: a share link (its label) or signed in as a member. */
  visitors: { via: 'link' | 'members'; shareLinkId: string | null; label: string; visitors: number; views: number }[];
  downloads: { label: string; format: string; path: string; count: number }[];
  searches: { query: string; count: number; lastSeen: string }[];
}
