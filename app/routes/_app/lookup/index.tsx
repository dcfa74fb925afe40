import { PageHeader } from "~/components/page-header";

export const meta = () => [{ title: "Lookup · Isopleth" }];

export default function Lookup() {
  return (
    <PageHeader title="Lookup">
      Properties at reservoir conditions, interpolated from a sample&apos;s approved grids with the method, the data
      zone used and an error estimate beside each number. This workspace is being built.
    </PageHeader>
  );
}
