import { PageHeader } from "~/components/page-header";

export const meta = () => [{ title: "API tokens · Isopleth" }];

export default function Tokens() {
  return (
    <PageHeader title="API tokens">
      Tokens let a reservoir simulator or a script pull approved tables without a person in the loop. Token
      management is being built.
    </PageHeader>
  );
}
