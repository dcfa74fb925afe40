import { requirePermission } from "~/.server/auth/guards";
import { PageHeader } from "~/components/page-header";
import type { Route } from "./+types/index";

export const meta: Route.MetaFunction = () => [{ title: "Compare · Isopleth" }];

export async function loader(args: Route.LoaderArgs) {
  requirePermission(args, "read:samples");
  return null;
}

export default function Compare() {
  return (
    <PageHeader title="Compare">
      Surface plots of one property for several samples side by side. This page is being built.
    </PageHeader>
  );
}
