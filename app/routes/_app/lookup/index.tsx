import { requirePermission } from "~/.server/auth/guards";
import { PageHeader } from "~/components/page-header";
import type { Route } from "./+types/index";

export const meta: Route.MetaFunction = () => [{ title: "Lookup · Isopleth" }];

export async function loader(args: Route.LoaderArgs) {
  requirePermission(args, "read:samples");
  return null;
}

export default function Lookup() {
  return (
    <PageHeader title="Lookup">
      Properties at reservoir conditions, interpolated from a sample&apos;s approved grids with the method, the data
      zone used and an error estimate beside each number. This workspace is being built.
    </PageHeader>
  );
}
