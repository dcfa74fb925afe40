import { createContext, useContext } from "react";

/**
 * The Content-Security-Policy nonce of the page being rendered on the server (scripts/server.mjs makes one per
 * request; app/entry.server.tsx provides it). In the browser it is empty: browsers hide nonces from the DOM.
 */
export const NonceContext = createContext<string | undefined>(undefined);

export function useNonce(): string | undefined {
  return useContext(NonceContext);
}
