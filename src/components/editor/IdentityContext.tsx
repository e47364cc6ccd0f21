// The identity reaches every node view through React context, so a changed colour re-renders the blocks that use it.
import { createContext, useContext } from 'react';
import type { Identity } from '@/lib/identity/types';

export const IdentityContext = createContext<Identity | null>(null);

/** The brand's identity inside the editor; node views never render outside the provider. */
export function useIdentity(): Identity {
  const identity = useContext(IdentityContext);
  if (!identity) throw new Error('useIdentity() needs the editor’s IdentityContext provider.');
  return identity;
}
