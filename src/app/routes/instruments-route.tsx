// The campaign's clocks and links (read from the persisted cache offline) and one instrument's
// page: its figures, the edit form and delete for geodesists, and its history.
import { useQueryClient } from "@tanstack/react-query";
import { useState, type ReactNode } from "react";
import { useNavigate, useParams } from "react-router-dom";
import { can } from "../../../shared/permissions";
import type { InstrumentView } from "../../../shared/schemas/instruments";
import { comparisonKeys } from "../../features/comparison/api/keys";
import { useInstrumentHistory } from "../../features/instruments/api/get-history";
import { useInstrument } from "../../features/instruments/api/get-instrument";
import { useInstruments } from "../../features/instruments/api/list-instruments";
import { DeleteInstrumentControl } from "../../features/instruments/components/delete-instrument-control";
import { InstrumentFigures } from "../../features/instruments/components/instrument-figures";
import { InstrumentForm } from "../../features/instruments/components/instrument-form";
import { InstrumentHistory } from "../../features/instruments/components/instrument-history";
import { InstrumentList } from "../../features/instruments/components/instrument-list";
import { Button, LinkButton } from "../../components/button";
import { Loading } from "../../components/loading";
import { Notice } from "../../components/notice";
import { PageHeader } from "../../components/page-header";
import { messageOf } from "../../lib/api-error";
import { useConnectivity } from "../../lib/use-connectivity";
import { useCampaign } from "../layouts/campaign-layout";
import { paths } from "../paths";

function NeedsConnection() {
  return (
    <Notice tone="attention" title="Needs a connection">
      Clocks and links are edited online. What was read before stays readable; try again when this
      device has a network.
    </Notice>
  );
}

function Section({ id, title, children }: { id: string; title: string; children: ReactNode }) {
  return (
    <section aria-labelledby={id} className="flex flex-col gap-3">
      <h2 id={id} className="text-xl font-semibold">
        {title}
      </h2>
      {children}
    </section>
  );
}

/** Height results read the instruments' figures on every request: let them be asked again. */
function useForgetResults() {
  const queryClient = useQueryClient();
  return () => void queryClient.invalidateQueries({ queryKey: comparisonKeys.all });
}

export function InstrumentsRoute() {
  const { campaignId, role } = useCampaign();
  const manage = can(role, "instrument.manage");
  const online = useConnectivity() === "online";
  const navigate = useNavigate();
  const forgetResults = useForgetResults();
  const instruments = useInstruments(campaignId);
  const [adding, setAdding] = useState(false);
  return (
    <>
      <PageHeader
        title="Instruments"
        lead="Clocks and links with their stated instability and systematic uncertainty"
        actions={
          <>
            {manage && !adding && (
              <Button tone="primary" onClick={() => setAdding(true)}>
                Add instrument
              </Button>
            )}
            <LinkButton to={paths.heights(campaignId)}>Heights</LinkButton>
          </>
        }
      />
      <div className="flex flex-col gap-8">
        {manage && adding && !online && <NeedsConnection />}
        {manage && adding && online && (
          <InstrumentForm
            campaignId={campaignId}
            instrument={null}
            onSaved={(saved) => {
              forgetResults();
              void navigate(paths.instrument(campaignId, saved.id));
            }}
            onCancel={() => setAdding(false)}
          />
        )}
        <Section id="instruments-heading" title="Clocks and links">
          {instruments.isPending ? (
            <Loading label="Reading the instruments…" />
          ) : instruments.data === undefined ? (
            <Notice tone="danger" title="Instruments not available">
              {messageOf(instruments.error)}
            </Notice>
          ) : (
            <InstrumentList
              instruments={instruments.data}
              hrefOf={(id) => paths.instrument(campaignId, id)}
              emptyText={
                manage
                  ? "No clock or link yet: add the clocks a comparison run compares, and its link."
                  : "No clock or link in this campaign yet."
              }
            />
          )}
        </Section>
      </div>
    </>
  );
}

interface EditPanelProps {
  campaignId: string;
  instrument: InstrumentView;
  onSaved: () => void;
  onCancel: () => void;
  onReload: () => void;
}

/** The edit form (keyed by version, so a reload opens it afresh) and delete, online only. */
function EditPanel({ campaignId, instrument, onSaved, onCancel, onReload }: EditPanelProps) {
  const online = useConnectivity() === "online";
  const navigate = useNavigate();
  const forgetResults = useForgetResults();
  if (!online) return <NeedsConnection />;
  return (
    <div className="flex flex-col gap-3">
      <InstrumentForm
        key={instrument.version}
        campaignId={campaignId}
        instrument={instrument}
        onSaved={() => {
          forgetResults();
          onSaved();
        }}
        onCancel={onCancel}
        onReload={onReload}
      />
      <DeleteInstrumentControl
        campaignId={campaignId}
        instrument={instrument}
        onDeleted={() => {
          forgetResults();
          void navigate(paths.instruments(campaignId));
        }}
      />
    </div>
  );
}

export function InstrumentRoute() {
  const { campaignId, role } = useCampaign();
  const { instrumentId = "" } = useParams();
  const manage = can(role, "instrument.manage");
  const instrument = useInstrument(campaignId, instrumentId);
  const history = useInstrumentHistory(campaignId, instrumentId);
  const [editing, setEditing] = useState(false);
  const [saved, setSaved] = useState(false);
  const back = <LinkButton to={paths.instruments(campaignId)}>All instruments</LinkButton>;
  if (instrument.isPending) return <Loading label="Reading the instrument…" />;
  if (instrument.data === undefined)
    return (
      <div className="flex flex-col gap-4">
        <Notice tone="danger" title="Instrument not available">
          {messageOf(instrument.error)}
        </Notice>
        <div>{back}</div>
      </div>
    );
  const i = instrument.data;
  const reload = async () => {
    await Promise.all([instrument.refetch(), history.refetch()]);
  };
  return (
    <>
      <PageHeader
        title={i.name}
        lead="Stated figures, used by the comparison runs' height budgets"
        actions={
          <>
            {manage && !editing && (
              <Button
                tone="primary"
                onClick={() => {
                  setSaved(false);
                  setEditing(true);
                }}
              >
                Edit instrument
              </Button>
            )}
            {back}
          </>
        }
      />
      <div className="flex flex-col gap-8">
        {saved && (
          <Notice tone="info" title="Saved" live>
            {i.name} saved as version {i.version}.
          </Notice>
        )}
        {manage && editing && (
          <EditPanel
            campaignId={campaignId}
            instrument={i}
            onSaved={() => {
              setEditing(false);
              setSaved(true);
            }}
            onCancel={() => setEditing(false)}
            onReload={() => void reload()}
          />
        )}
        <Section id="figures-heading" title="Figures">
          <InstrumentFigures instrument={i} />
        </Section>
        <Section id="history-heading" title="History">
          {history.isPending ? (
            <Loading label="Reading the history…" />
          ) : history.data === undefined ? (
            <Notice tone="danger" title="History not available">
              {messageOf(history.error)}
            </Notice>
          ) : (
            <InstrumentHistory revisions={history.data} />
          )}
        </Section>
      </div>
    </>
  );
}
