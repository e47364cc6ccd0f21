// The people around a brand, from the designer who owns it to the client's wider team.
export const BRAND_ROLES = ['owner', 'editor', 'reviewer', 'partner', 'viewer'] as const;
export type BrandRole = (typeof BRAND_ROLES)[number];

/** Studio admins manage the studio; any studio member may start brands in it. Brand access is per brand. */
export const STUDIO_ROLES = ['admin', 'member'] as const;
export type StudioRole = (typeof STUDIO_ROLES)[number];

/** Words shown beside each role in the members table. */
export const ROLE_LABELS: Record<BrandRole, { label: string; summary: string }> = {
  owner: { label: 'Owner', summary: 'Everything, including members, share links and deletion' },
  editor: { label: 'Editor', summary: 'Edits identity and guidelines, uploads, publishes versions' },
  reviewer: { label: 'Reviewer', summary: 'Reads drafts, comments, approves or asks for changes' },
  partner: { label: 'Partner', summary: 'Reads published versions, downloads approved assets' },
  viewer: { label: 'Viewer', summary: 'Reads published versions' },
};
