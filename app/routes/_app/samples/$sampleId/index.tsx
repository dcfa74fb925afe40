import { Form, href, Link, useNavigation, useSearchParams } from "react-router";
import { z } from "zod";
import { requirePermission } from "~/.server/auth/guards";
import { badRequest, parseForm } from "~/.server/forms";
import { requireSample } from "~/.server/samples/params";
import { changeFollowing, loadSamplePage } from "~/.server/samples/sample-page";
import { Button, FormAlert } from "~/components/form";
import { CurrentTables } from "~/components/samples/current-tables";
import { DraftsAwaitingReview } from "~/components/samples/drafts-awaiting-review";
import { SAMPLE_TYPE_LABELS } from "~/components/samples/labels";
import { RevisionHistory } from "~/components/samples/revision-history";
import { SampleRecord } from "~/components/samples/sample-record";
import type { Route } from "./+types/index";

export const meta: Route.MetaFunction = ({ data }) => [
  { title: `${data?.sample.label ?? "Sample"} · Isopleth` },
];

const FollowSchema = z.object({
  intent: z.enum(["follow", "unfollow"], {
    error: "Choose follow or unfollow.",
  }),
});

export async function loader(args: Route.LoaderArgs) {
  const user = requirePermission(args, "read:samples");
  const sample = await requireSample(args.params);
  return loadSamplePage(sample, user);
}

export async function action(args: Route.ActionArgs) {
  const user = requirePermission(args, "read:samples");
  const sample = await requireSample(args.params);
  const form = await parseForm(args.request, FollowSchema);
  if (!form.ok)
    return badRequest({
      errors: form.errors,
      formError: "That request was not understood.",
    });
  return {
    errors: {},
    done: await changeFollowing(sample.id, user.id, form.data.intent),
  };
}

export default function SamplePage({
  loaderData,
  actionData,
}: Route.ComponentProps) {
  const { sample, units, revisions, current, following, followers } =
    loaderData;
  const navigation = useNavigation();
  const [params] = useSearchParams();
  const id = String(sample.id);
  const flash = params.get("created")
    ? "The sample is created. Upload its measured results next."
    : params.get("saved")
      ? "The sample's record is saved."
      : null;
  const done = actionData && "done" in actionData ? actionData.done : null;
  const formError =
    actionData && "formError" in actionData ? actionData.formError : null;
  return (
    <>
      <nav aria-label="Breadcrumb" className="mb-2 text-sm text-ink-muted">
        <Link to={href("/samples")} className="hover:underline">
          Samples
        </Link>{" "}
        › {sample.fieldName} › {sample.wellName}
      </nav>
      <div className="mb-6 flex flex-wrap items-start justify-between gap-4">
        <div>
          <h1 className="text-2xl font-bold tracking-tight">{sample.label}</h1>
          <p className="mt-1 text-ink-muted">
            {SAMPLE_TYPE_LABELS[sample.sampleType] ?? sample.sampleType} sample
            from well {sample.wellName}, {sample.fieldName}
          </p>
        </div>
        <div className="flex flex-wrap items-center gap-2">
          <Form method="post">
            <Button
              type="submit"
              name="intent"
              value={following ? "unfollow" : "follow"}
              variant="secondary"
              disabled={navigation.state === "submitting"}
            >
              {following ? "Unfollow" : "Follow"}
            </Button>
          </Form>
          {loaderData.can.edit ? (
            <Link
              to={href("/samples/:sampleId/edit", { sampleId: id })}
              className="rounded border border-line bg-panel px-4 py-2 text-sm font-semibold hover:border-accent"
            >
              Edit record
            </Link>
          ) : null}
          {loaderData.can.upload ? (
            <Link
              to={href("/samples/:sampleId/upload", { sampleId: id })}
              className="rounded bg-accent px-4 py-2 text-sm font-semibold text-white hover:bg-accent-strong"
            >
              Upload results
            </Link>
          ) : null}
        </div>
      </div>
      <div className="mb-4 space-y-2">
        <FormAlert message={flash ?? done} tone="ok" />
        <FormAlert message={formError} />
      </div>
      <p className="mb-4 text-sm text-ink-muted">
        {following ? "You follow this sample. " : ""}
        {followers === 0
          ? "Nobody follows this sample yet."
          : `${followers} ${followers === 1 ? "person follows" : "people follow"} this sample.`}
      </p>

      <SampleRecord
        sample={sample}
        units={units}
        bubblePoints={
          current
            ? {
                revisionNumber: current.revision.number,
                table: current.bubblePoints,
              }
            : null
        }
      />
      <DraftsAwaitingReview
        sampleId={id}
        drafts={revisions.filter((r) => r.status === "draft")}
        canReview={loaderData.can.review}
      />
      <CurrentTables
        sampleId={id}
        current={current}
        canUpload={loaderData.can.upload}
      />
      <RevisionHistory
        sampleId={id}
        sampleLabel={sample.label}
        revisions={revisions}
      />
    </>
  );
}
