import { requirePermission } from "~/.server/auth/guards";
import { PageHeader } from "~/components/page-header";
import type { Route } from "./+types/diff";

// Placeholder until the lab-results pages land.
export async function loader(args: Route.LoaderArgs) {
  requirePermission(args, "read:samples");
  return null;
}

export default function Placeholder() {
  return <PageHeader title="Coming soon">This page is being built.</PageHeader>;
}
