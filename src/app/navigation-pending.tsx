import { createContext, useContext } from 'react';

const PendingContext = createContext(false);

/** Whether a navigation is under way: the next page's code is on its way while the current page stays on screen. */
export const NavigationPending = PendingContext.Provider;

export const useNavigationPending = () => useContext(PendingContext);
