// The brand's client page: follow, invitations, briefs, mood boards, palette routes and reviews, each with what to do next.
import { QueryRoot } from '@/components/app/QueryRoot';
import { Boards } from './boards/Boards';
import { Briefs } from './briefs/Briefs';
import { Follow } from './Follow';
import { Invitations } from './Invitations';
import { PaletteRoutes } from './palettes/PaletteRoutes';
import { Reviews } from './reviews/Reviews';
import type { ClientCaps } from './chrome';

export default function ClientWorkspace({ brandId, caps }: { brandId: string; caps: ClientCaps }) {
  return (
    <QueryRoot>
      <Follow brandId={brandId} />
      {caps.manageMembers && <Invitations brandId={brandId} />}
      <Briefs brandId={brandId} caps={caps} />
      <Boards brandId={brandId} caps={caps} />
      <PaletteRoutes brandId={brandId} caps={caps} />
      <Reviews brandId={brandId} caps={caps} />
    </QueryRoot>
  );
}
