import { PageHeader } from "~/components/page-header";

export const meta = () => [{ title: "Compare · Isopleth" }];

export default function Compare() {
  return (
    <PageHeader title="Compare">
      Surface plots of one property for several samples side by side. This page is being built.
    </PageHeader>
  );
}
