import { useState } from "react";
import { data, Form, href, Link, redirect, useNavigation } from "react-router";
import { getCaller, requirePermission } from "~/.server/auth/guards";
import { requireSample } from "~/.server/samples/params";
import {
  getUploadPage,
  handleUploadSubmission,
} from "~/.server/samples/upload-submission";
import { Button, FormAlert, useZodForm } from "~/components/form";
import { PageHeader } from "~/components/page-header";
import { UploadFileChooser } from "~/components/samples/upload-file-chooser";
import { UploadLayoutGuide } from "~/components/samples/upload-layout-guide";
import { UploadPreviewPanel } from "~/components/samples/upload-preview";
import { RefusedUploadNotice } from "~/components/samples/upload-refused";
import { readIntent } from "~/utils/forms";
import {
  fileTooLargeText,
  UPLOAD_LIMIT_BYTES,
  UploadSchema,
} from "~/utils/upload-form";
import type { Route } from "./+types/upload";

/*
 * Upload of measured results, stateless: "Check file" previews the file, storing nothing; "Store as draft
 * revision" sends the same file again and stores exactly what it holds (app/.server/samples/upload-submission.ts
 * says how). Leaving the page stores nothing.
 */

export const meta: Route.MetaFunction = ({ data }) => [
  { title: `Upload results · ${data?.sample.label ?? "Sample"} · Isopleth` },
];

export async function loader(args: Route.LoaderArgs) {
  requirePermission(args, "upload:revisions");
  const sample = await requireSample(args.params);
  return getUploadPage(sample);
}

export async function action(args: Route.ActionArgs) {
  const user = requirePermission(args, "upload:revisions");
  const { ipAddress } = getCaller(args);
  const sample = await requireSample(args.params);
  const outcome = await handleUploadSubmission(
    args.request,
    user,
    sample,
    ipAddress,
  );
  if (outcome.kind === "sample_gone")
    throw data(`Sample ${sample.label} no longer exists; nothing was stored.`, {
      status: 404,
    });
  if (outcome.kind === "stored")
    throw redirect(
      `${href("/samples/:sampleId/revisions/:number", { sampleId: String(sample.id), number: String(outcome.number) })}?stored=1`,
    );
  return data(outcome.reply, { status: outcome.status });
}

export default function Upload({
  loaderData,
  actionData,
}: Route.ComponentProps) {
  const { sample, nextNumber, guide, hasGravities } = loaderData;
  const navigation = useNavigation();
  const reply = actionData;
  const form = useZodForm(
    UploadSchema,
    reply && "errors" in reply ? reply.errors : undefined,
  );
  // Choosing another file hides the preview or refusal of the answer it was chosen over; the next answer shows.
  const [staleReply, setStaleReply] = useState<typeof reply | null>(null);
  const [sizeError, setSizeError] = useState<string | null>(null);
  const stale = reply !== undefined && staleReply === reply;
  const sampleUrl = href("/samples/:sampleId", { sampleId: String(sample.id) });
  const busy = navigation.state === "submitting";
  const pressed = navigation.formData ? readIntent(navigation.formData) : "";
  const formError = reply && "formError" in reply ? reply.formError : undefined;
  const shown = !stale && reply && "preview" in reply ? reply : null;
  const refused = !stale && reply?.kind === "refused" ? reply.refused : null;
  const fileErrors = [
    ...(sizeError ? [sizeError] : []),
    ...(form.errors.file ?? []),
  ];
  return (
    <>
      <nav aria-label="Breadcrumb" className="mb-2 text-sm text-ink-muted">
        <Link to={href("/samples")} className="hover:underline">
          Samples
        </Link>{" "}
        ›{" "}
        <Link to={sampleUrl} className="hover:underline">
          {sample.label}
        </Link>{" "}
        › Upload
      </nav>
      <PageHeader title={`Upload results for ${sample.label}`}>
        Well {sample.wellName}, {sample.fieldName}. One CSV or XLSX file with
        the measured results of this sample, in the long or the grid layout (see
        below). You see the parsed grids and the quality checks before anything
        is stored.
      </PageHeader>

      <Form
        method="post"
        encType="multipart/form-data"
        noValidate
        onSubmit={form.onSubmit}
        className="space-y-6"
      >
        <UploadFileChooser
          errors={fileErrors}
          onFileChosen={(chosen) => {
            setStaleReply(reply);
            setSizeError(
              chosen && chosen.size > UPLOAD_LIMIT_BYTES
                ? fileTooLargeText(chosen.name)
                : null,
            );
          }}
          previewShown={!!shown}
          checking={busy && pressed === "preview"}
          busy={busy}
          blocked={!!sizeError}
        />

        {shown ? null : <FormAlert message={formError} />}

        {refused ? <RefusedUploadNotice refused={refused} /> : null}

        {shown ? (
          <UploadPreviewPanel
            preview={shown.preview}
            nextNumber={nextNumber}
            errors={form.errors}
            hasGravities={hasGravities}
            identical={shown.identical}
            comment={shown.comment}
          />
        ) : null}

        {shown ? <FormAlert message={formError} /> : null}

        {shown ? (
          <div className="flex flex-wrap items-center gap-4">
            <Button type="submit" name="intent" value="confirm" disabled={busy}>
              {busy && pressed === "confirm"
                ? "Storing…"
                : `Store as draft revision ${nextNumber}`}
            </Button>
            <Link to={sampleUrl} className="text-sm text-accent underline">
              Cancel (nothing is stored)
            </Link>
          </div>
        ) : (
          <p className="text-sm">
            <Link to={sampleUrl} className="text-accent underline">
              Back to {sample.label}
            </Link>
          </p>
        )}
      </Form>

      <UploadLayoutGuide blocks={guide} openLayouts={!shown} />
    </>
  );
}
