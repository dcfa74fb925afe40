import { createContext } from "react-router";
import type { SessionUser } from "./session";

/** Who is calling, set by the root middleware for every request. */
export type Caller = {
  user: SessionUser | null;
  sessionId: string | null;
  ipAddress: string;
};

export const callerContext = createContext<Caller>({
  user: null,
  sessionId: null,
  ipAddress: "unknown",
});
