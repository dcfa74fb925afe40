import { requirePermission } from "~/.server/auth/guards";
import { PageHeader } from "~/components/page-header";
import type { Route } from "./+types/index";

export const meta: Route.MetaFunction = () => [{ title: "API tokens · Isopleth" }];

export async function loader(args: Route.LoaderArgs) {
  requirePermission(args, "manage:own-tokens");
  return null;
}

export default function Tokens() {
  return (
    <PageHeader title="API tokens">
      Tokens let a reservoir simulator or a script pull approved tables without a person in the loop. Token
      management is being built.
    </PageHeader>
  );
}
