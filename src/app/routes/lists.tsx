import { Link } from 'react-router-dom';
import { useMe } from '../../features/auth/api/get-me';
import { ListsIndex } from '../../features/lists/components/lists-index';
import { TradeOnly } from '../../features/trade/components/trade-only';

export function ListsRoute() {
  const me = useMe();
  return (
    <div className="grid min-w-0 gap-4">
      <nav aria-label="Breadcrumb" className="text-sm text-cast">
        <Link to="/account" className="hover:underline">
          Account
        </Link>{' '}
        / Parts lists
      </nav>
      <h1 className="text-3xl font-bold">Parts lists</h1>
      <TradeOnly me={me} path="/trade/lists" what="Keeping parts lists">
        <ListsIndex companyName={me.data?.user?.dealer?.companyName ?? 'your trade account'} />
      </TradeOnly>
    </div>
  );
}
