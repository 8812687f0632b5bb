import { useQueryClient } from '@tanstack/react-query';
import { Link, useParams } from 'react-router-dom';
import { useMe } from '../../features/auth/api/get-me';
import { cartKeys } from '../../features/cart/api/keys';
import { ListDetail } from '../../features/lists/components/list-detail';
import { TradeOnly } from '../../features/trade/components/trade-only';

export function ListRoute() {
  const { id = '' } = useParams();
  const me = useMe();
  const qc = useQueryClient();
  return (
    <div className="grid min-w-0 gap-4">
      <nav aria-label="Breadcrumb" className="text-sm text-cast">
        <Link to="/trade/lists" className="hover:underline">
          Parts lists
        </Link>
      </nav>
      <TradeOnly me={me} path={`/trade/lists/${id}`} what="Keeping parts lists">
        <ListDetail id={Number(id)} onAdded={() => void qc.invalidateQueries({ queryKey: cartKeys.all })} />
      </TradeOnly>
    </div>
  );
}
