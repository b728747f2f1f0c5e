import { useState } from "react";
import { Link, useNavigate } from "react-router-dom";
import { useQuery } from "@tanstack/react-query";
import { MAX_COMPARED_DESIGNS } from "../../../shared/schemas/design";
import { ApiError } from "../../api/client";
import { designFiltersFrom, designsQueryOptions, useDeleteDesign, useDuplicateDesign, useUpdateDesign, type DesignJson } from "../../api/designs";
import { QueryError } from "../../components/query-error";
import { Button, ButtonLink } from "../../components/ui/button";
import { TextField } from "../../components/ui/field";
import { Pager, SearchBox, SortChoice } from "../../components/ui/list-controls";
import { Panel } from "../../components/ui/panel";
import { ResponsiveTable } from "../../components/ui/responsive-table";
import { Loading } from "../../components/ui/spinner";
import { StatusNote } from "../../components/ui/status-note";
import { paths } from "../../config/paths";
import { formatDateTime } from "../../lib/format";
import { useListParams } from "../../lib/use-list-params";
import { designToParams } from "./design-url";
import { draftFromSaved } from "./saved-design";

/** The design check's address for a saved design: the design itself, and which saved design it is. */
export function openHref(design: DesignJson): string {
  const search = designToParams(draftFromSaved(design.configuration));
  search.set("saved", design.id);
  return paths.designCheck.href(search);
}

const sorts = { updatedAt: "Last changed", name: "Name", createdAt: "First saved" } as const;

/** The organisation's saved designs: search, sort, pages; open, rename, duplicate, delete, and pick up to three to compare. */
export function SavedDesigns() {
  const [search, setParams] = useListParams();
  const filters = designFiltersFrom(search);
  const designs = useQuery(designsQueryOptions(filters));
  const [picked, setPicked] = useState<string[]>([]);
  const [note, setNote] = useState<{ tone: "ok" | "danger"; text: string } | null>(null);
  const navigate = useNavigate();
  const toggle = (id: string) => setPicked((p) => (p.includes(id) ? p.filter((x) => x !== id) : p.length >= MAX_COMPARED_DESIGNS ? p : [...p, id]));

  return (
    <Panel
      title="Saved designs"
      actions={
        <ButtonLink to={paths.designCheck.href()} variant="secondary">
          Check a new design
        </ButtonLink>
      }
    >
      <SearchBox label="Search by name" value={filters.q} onSearch={(q) => setParams({ q })}>
        <SortChoice id="design-sort" sorts={sorts} sort={filters.sort} dir={filters.dir} onChange={(sort, dir) => setParams({ sort, dir })} directions={(key) => (key === "name" ? [" (Z–A)", " (A–Z)"] : [" (newest first)", " (oldest first)"])} />
      </SearchBox>

      <div className="mb-4 flex flex-wrap items-center gap-3" role="group" aria-label="Compare designs">
        <Button disabled={picked.length < 2} onClick={() => navigate(paths.designCompare.href(picked))}>
          Compare {picked.length > 0 ? `${picked.length} ` : ""}side by side
        </Button>
        <p className="text-meta text-flux-600" aria-live="polite">
          {picked.length === 0 ? `Tick two or three designs to compare them.` : picked.length >= MAX_COMPARED_DESIGNS ? `${picked.length} chosen: that is the most that fit side by side.` : `${picked.length} chosen.`}
        </p>
        {picked.length > 0 && (
          <Button variant="quiet" onClick={() => setPicked([])}>
            Clear the choice
          </Button>
        )}
      </div>
      {note && (
        <StatusNote tone={note.tone} live={note.tone === "ok" ? "polite" : "assertive"} className="mb-4">
          {note.text}
        </StatusNote>
      )}

      {designs.isPending ? (
        <Loading label="Loading your designs…" />
      ) : designs.isError ? (
        <QueryError error={designs.error} onRetry={() => void designs.refetch()} what="your saved designs" />
      ) : designs.data.items.length === 0 ? (
        <p className="rounded-md bg-nickel-100 p-4 text-flux-700" data-testid="designs-empty">
          {filters.q ? (
            <>No design’s name contains “{filters.q}”.</>
          ) : (
            <>
              No saved designs yet.{" "}
              <Link className="font-semibold underline underline-offset-4" to={paths.designCheck.href()}>
                Check a design
              </Link>{" "}
              and save it under a name.
            </>
          )}
        </p>
      ) : (
        <>
          <ResponsiveTable<DesignJson>
            caption={`Saved designs, page ${filters.page}`}
            testId="designs-table"
            rowTestId="design-row"
            rows={designs.data.items}
            rowKey={(d) => d.id}
            cardsBelow={760}
            columns={[
              {
                key: "pick",
                header: "Compare",
                cell: (d) => (
                  <input
                    type="checkbox"
                    className="size-5 accent-anneal-600"
                    aria-label={`Compare “${d.name}”`}
                    checked={picked.includes(d.id)}
                    disabled={!picked.includes(d.id) && picked.length >= MAX_COMPARED_DESIGNS}
                    onChange={() => toggle(d.id)}
                  />
                ),
              },
              {
                key: "name",
                header: "Name",
                primary: true,
                cell: (d) => (
                  <Link className="font-semibold text-flux-800 underline underline-offset-4" to={openHref(d)}>
                    {d.name}
                  </Link>
                ),
              },
              { key: "what", header: "Design", cell: (d) => d.summary },
              { key: "need", header: "Needs", align: "end", className: "font-mono whitespace-nowrap", cell: (d) => `${d.configuration.requiredAttenuation_db} dB` },
              { key: "changed", header: "Last changed", className: "font-mono whitespace-nowrap", cell: (d) => formatDateTime(d.updatedAt) },
              { key: "actions", header: "Actions", cell: (d) => <DesignActions design={d} onDone={setNote} /> },
            ]}
          />
          <Pager page={filters.page} pageSize={filters.pageSize} total={designs.data.total} noun={["design", "designs"]} label="Design list pages" onPage={(page) => setParams({ page })} />
        </>
      )}
    </Panel>
  );
}

type Asking = "rename" | "delete" | null;

function DesignActions({ design, onDone }: { design: DesignJson; onDone: (n: { tone: "ok" | "danger"; text: string }) => void }) {
  const [asking, setAsking] = useState<Asking>(null);
  const [name, setName] = useState(design.name);
  const [nameError, setNameError] = useState<string | undefined>();
  const rename = useUpdateDesign();
  const duplicate = useDuplicateDesign();
  const remove = useDeleteDesign();
  const problem = (e: unknown) => onDone({ tone: "danger", text: e instanceof ApiError ? (Object.values(e.fields)[0] ?? e.message) : "Something went wrong. Try again." });

  return (
    <div className="space-y-2">
      <div className="flex flex-wrap gap-x-1">
        {design.abilities.update && (
          <Button variant="quiet" className="min-h-9 px-2 text-meta" aria-expanded={asking === "rename"} onClick={() => setAsking(asking === "rename" ? null : "rename")} aria-label={`Rename “${design.name}”`}>
            Rename…
          </Button>
        )}
        {design.abilities.update && (
          <Button
            variant="quiet"
            className="min-h-9 px-2 text-meta"
            pending={duplicate.isPending}
            pendingLabel="Copying…"
            aria-label={`Duplicate “${design.name}”`}
            onClick={() =>
              duplicate.mutate({ id: design.id }, { onSuccess: (copy) => onDone({ tone: "ok", text: `Copied as “${copy.name}”.` }), onError: problem })
            }
          >
            Duplicate
          </Button>
        )}
        {design.abilities.delete && (
          <Button variant="quiet" className="min-h-9 px-2 text-meta" aria-expanded={asking === "delete"} onClick={() => setAsking(asking === "delete" ? null : "delete")} aria-label={`Delete “${design.name}”`}>
            Delete…
          </Button>
        )}
      </div>
      {asking === "rename" && (
        <form
          className="flex flex-wrap items-end gap-2"
          onSubmit={(e) => {
            e.preventDefault();
            setNameError(undefined);
            rename.mutate(
              { id: design.id, name },
              {
                onSuccess: (d) => {
                  setAsking(null);
                  onDone({ tone: "ok", text: `Renamed to “${d.name}”.` });
                },
                onError: (e) => (e instanceof ApiError && e.fields.name ? setNameError(e.fields.name) : problem(e)),
              },
            );
          }}
        >
          <div className="min-w-0 flex-1 basis-40">
            <TextField label="New name" value={name} onChange={(e) => setName(e.target.value)} error={nameError} autoFocus />
          </div>
          <Button type="submit" className="min-h-9" pending={rename.isPending} pendingLabel="Saving…">
            Rename
          </Button>
          <Button variant="secondary" className="min-h-9" onClick={() => setAsking(null)}>
            Cancel
          </Button>
        </form>
      )}
      {asking === "delete" && (
        <div className="space-y-2 rounded-md border border-caution-200 bg-caution-50 p-2" role="group" aria-label={`Confirm deleting “${design.name}”`}>
          <p className="text-meta text-caution-900">Delete “{design.name}”? Quotes already made from it keep their own copy of the design.</p>
          <div className="flex flex-wrap gap-2">
            <Button
              variant="danger"
              className="min-h-9"
              pending={remove.isPending}
              pendingLabel="Deleting…"
              onClick={() => remove.mutate(design.id, { onSuccess: () => onDone({ tone: "ok", text: `Deleted “${design.name}”.` }), onError: problem })}
            >
              Delete the design
            </Button>
            <Button variant="secondary" className="min-h-9" onClick={() => setAsking(null)} autoFocus>
              Keep it
            </Button>
          </div>
        </div>
      )}
    </div>
  );
}
