import { ChevronDown, UserRound } from 'lucide-react';
import { Button, Header, Menu, MenuItem, MenuSection, MenuTrigger, Popover, RouterProvider as AriaRouterProvider, Separator } from 'react-aria-components';
import { useHref, useNavigate } from 'react-router-dom';
import type { Me } from '../../../../shared/schemas/accounts';
import { useSignOut } from '../api/sign-out';
import { ROLE_LABELS } from '../roles';

type User = NonNullable<Me['user']>;

const itemClass =
  'flex min-h-10 cursor-pointer items-center rounded px-3 py-2 text-ink outline-none data-[focused]:bg-temper-tint data-[focused]:text-temper-deep data-[pressed]:bg-temper-tint';

/**
 * The signed-in person's menu: who they are, where their things are, and sign-out (which, with the reply's schema,
 * loads with the menu rather than with every first page).
 */
export function AccountMenu({ user, onSignedOut }: { user: User; onSignedOut: () => void }) {
  const trade = user.role === 'dealer';
  const navigate = useNavigate();
  const signOut = useSignOut(onSignedOut);
  const signingOut = signOut.isPending;
  return (
    <>
      {/* Menu links navigate inside the app instead of reloading the page. */}
      <AriaRouterProvider navigate={navigate} useHref={useHref}>
        <MenuTrigger>
          <Button
            aria-label={`Account menu for ${user.name}, ${ROLE_LABELS[user.role]}`}
            className="inline-flex min-h-11 max-w-56 items-center gap-2 rounded-md border border-cast-line bg-white px-3 text-left text-ink outline-none hover:border-temper data-[focus-visible]:outline-3 data-[focus-visible]:outline-offset-2 data-[focus-visible]:outline-temper"
          >
            <UserRound aria-hidden className="size-5 shrink-0 text-temper" />
            <span className="grid min-w-0 leading-tight">
              <span className="truncate font-semibold">{user.name}</span>
              <span className="truncate text-xs text-cast">{ROLE_LABELS[user.role]}</span>
            </span>
            <ChevronDown aria-hidden className="size-4 shrink-0" />
          </Button>
          <Popover placement="bottom end" className="min-w-60 rounded-md border border-cast-line bg-white p-1 shadow-lg outline-none">
            <Menu aria-label="Account" className="outline-none">
              <MenuSection>
                <Header className="px-3 py-2">
                  <span className="block font-semibold">{user.name}</span>
                  <span className="block text-sm text-cast">
                    {ROLE_LABELS[user.role]}
                    {user.dealer?.status === 'approved' ? ` · ${user.dealer.companyName}` : ''}
                  </span>
                </Header>
                <MenuItem href="/account" className={itemClass}>
                  Account
                </MenuItem>
                <MenuItem href="/orders" className={itemClass}>
                  Orders
                </MenuItem>
                {(user.role === 'customer' || trade) && (
                  <MenuItem href="/returns" className={itemClass}>
                    Returns
                  </MenuItem>
                )}
                {(user.role === 'customer' || trade) && (
                  <MenuItem href="/account/units" className={itemClass}>
                    My units
                  </MenuItem>
                )}
                {(user.role === 'customer' || trade) && (
                  <MenuItem href="/service" className={itemClass}>
                    Service
                  </MenuItem>
                )}
                {(user.role === 'customer' || trade) && (
                  <MenuItem href="/notices" className={itemClass}>
                    Notices
                  </MenuItem>
                )}
                {trade && (
                  <MenuItem href="/trade/quick-order" className={itemClass}>
                    Quick order
                  </MenuItem>
                )}
                {trade && (
                  <MenuItem href="/trade/stock-list" className={itemClass}>
                    Stock list
                  </MenuItem>
                )}
                {trade && (
                  <MenuItem href="/trade/lists" className={itemClass}>
                    Parts lists
                  </MenuItem>
                )}
                <MenuItem href="/fitment/saved" className={itemClass}>
                  Saved checks
                </MenuItem>
              </MenuSection>
              <Separator className="my-1 border-t border-cast-line" />
              <MenuItem id="sign-out" onAction={() => signOut.mutate()} isDisabled={signingOut} className={itemClass}>
                {signingOut ? 'Signing out…' : 'Sign out'}
              </MenuItem>
            </Menu>
          </Popover>
        </MenuTrigger>
      </AriaRouterProvider>
      {signOut.isError && (
        <p role="alert" className="basis-full text-right text-sm font-semibold text-oxide">
          Sign-out did not go through. Try again.
        </p>
      )}
    </>
  );
}
