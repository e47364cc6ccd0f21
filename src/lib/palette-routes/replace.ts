// Replacing a palette by a route: which stored colour row each of the route's colours takes over (pure).

/**
 * Which existing colour row each of the route's colours takes over: first a row with the same role, then the rest in
 * palette order. Rows keep their ids, so guideline blocks that point at "the primary colour" show the new primary.
 */
export function matchRows<T extends { role: string | null }>(existing: readonly T[], incoming: readonly { role: string | null }[]): (T | null)[] {
  const free = [...existing];
  const take = (pick: (row: T) => boolean) => {
    const i = free.findIndex(pick);
    return i < 0 ? null : free.splice(i, 1)[0];
  };
  const byRole = incoming.map((c) => (c.role ? take((row) => row.role === c.role) : null));
  return byRole.map((found) => found ?? take(() => true));
}
