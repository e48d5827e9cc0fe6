import { Caution } from '../../../components/ui/caution';
import { useCallback, useState } from 'react';
import { useDropzone } from 'react-dropzone';
import { useNavigate, useSearchParams } from 'react-router-dom';
import { useQuery } from '@tanstack/react-query';
import type { Aircraft } from '../../../../shared/schemas/aircraft';
import { mapCoveringHeaders } from '../../../../shared/log/column-map';
import { saveRereadMap } from '../../../lib/local-db';
import { synthesiseSampleFile } from '../../../lib/log-pipeline/pipeline';
import { isLogFile } from '../model/import-jobs';
import { useImportQueue } from '../model/use-import-queue';
import { loadRemapSource } from '../model/remap-source';
import { localKeys } from '../../../api/local';
import { usePresets, useSavePreset } from '../../../api/presets';
import { AircraftPicker, UNKNOWN_AIRCRAFT } from './aircraft-picker';
import { ColumnMapStep } from './column-map-step';
import { JobRow } from './job-row';

export interface ImportPanelProps {
  /** The team flights go to, or null when signed out (flights stay on this device). */
  teamId: string | null;
  /** Tuners and owners may save import presets. */
  canSavePreset: boolean;
  /** Called when the only file of a drop is analysed: the review opens straight away. */
  onOpenFlight: (flightId: string) => void;
}

export function ImportPanel({ teamId, canSavePreset, onOpenFlight }: ImportPanelProps) {
  const [aircraftId, setAircraftId] = useState(UNKNOWN_AIRCRAFT);
  const [aircraft, setAircraft] = useState<Aircraft | null>(null);
  const [rejected, setRejected] = useState<string[]>([]);
  const [sampleBusy, setSampleBusy] = useState(false);
  const [sampleError, setSampleError] = useState<string | null>(null);
  const presets = usePresets(teamId ?? '', teamId !== null);
  const { jobs, dispatch, addFiles, cancel, openMap } = useImportQueue({
    teamId,
    aircraft,
    presets: presets.data?.presets,
    onOpenFlight,
  });
  const savePreset = useSavePreset(teamId ?? '');

  // `?remap=<flight id>`: the review's filter bench could not read a kept flight's raw log
  // again without a column map; the map confirmed here is kept on this device for that flight.
  const [params, setParams] = useSearchParams();
  const navigate = useNavigate();
  const remapId = params.get('remap');
  const remap = useQuery({
    queryKey: localKeys.remapSource(remapId),
    queryFn: () => loadRemapSource(remapId!),
    enabled: remapId !== null,
    staleTime: Infinity,
    retry: false,
    networkMode: 'always',
  });
  const [remapError, setRemapError] = useState<string | null>(null);
  const endRemap = () =>
    setParams(
      (old) => {
        const next = new URLSearchParams(old);
        next.delete('remap');
        return next;
      },
      { replace: true },
    );

  const onDrop = useCallback(
    (accepted: File[], refused: { file: File }[]) => {
      const good = accepted.filter(isLogFile);
      const bad = [...accepted.filter((f) => !isLogFile(f)), ...refused.map((r) => r.file)];
      setRejected(bad.map((f) => f.name));
      if (good.length > 0) addFiles(good);
    },
    [addFiles],
  );
  const { getRootProps, getInputProps, isDragActive, open } = useDropzone({
    onDrop,
    noClick: true,
    multiple: true,
  });

  const trySample = async () => {
    setSampleBusy(true);
    setSampleError(null);
    try {
      addFiles([await synthesiseSampleFile()]);
    } catch (e) {
      setSampleError(e instanceof Error ? e.message : String(e));
    } finally {
      setSampleBusy(false);
    }
  };

  const mapping = jobs.find((j) => j.status.kind === 'needs-map');

  return (
    <div className="grid grid-cols-[minmax(0,1fr)] gap-6 lg:grid-cols-[minmax(0,1fr)_20rem]">
      <div className="flex flex-col gap-4">
        <div
          {...getRootProps({
            className:
              'flex flex-col items-center justify-center gap-3 rounded border-2 border-dashed px-6 py-10 text-center transition-colors ' +
              (isDragActive ? 'border-accent bg-accent-soft' : 'border-line bg-paper-raised'),
          })}
        >
          <input {...getInputProps({ 'aria-label': 'Flight logs' })} />
          <p className="text-base text-ink">Drop flight logs here</p>
          <p className="text-sm text-ink-soft">
            <span className="num">.csv</span> or <span className="num">.csv.gz</span>, one or many.
            They are read and analysed on this device; nothing is sent until you are signed in and
            online.
          </p>
          <div className="flex gap-2">
            <button
              type="button"
              onClick={open}
              className="rounded bg-slate-brand px-3 py-1.5 text-sm font-medium text-paper"
            >
              Choose files…
            </button>
            <button
              type="button"
              onClick={() => void trySample()}
              disabled={sampleBusy}
              className="rounded border border-line px-3 py-1.5 text-sm text-ink-soft disabled:opacity-50"
            >
              {sampleBusy ? 'Synthesising…' : 'Try a sample flight'}
            </button>
          </div>
          {sampleError && (
            <p role="alert" className="text-sm text-sev-act">
              The sample flight could not be made: {sampleError}
            </p>
          )}
        </div>
        {rejected.length > 0 && (
          <p role="alert" className="text-sm text-sev-act">
            Not a log we read (.csv or .csv.gz): <span className="num">{rejected.join(', ')}</span>
          </p>
        )}
        {remapId !== null && (
          <section
            aria-label="Column map for a kept flight"
            className="flex flex-col gap-2 rounded border border-line bg-paper-raised p-3"
          >
            <p className="text-sm text-ink-soft">
              Map the columns of a flight already kept, so its review can read the raw log again
              (filter bench). Nothing is imported again.
            </p>
            {remap.isPending && <p className="text-sm text-ink-soft">Reading its header…</p>}
            {remap.isError && (
              <p role="alert" className="text-sm text-sev-act">
                {remap.error.message}
              </p>
            )}
            {remapError && (
              <p role="alert" className="text-sm text-sev-act">
                The map was not kept: {remapError}
              </p>
            )}
            {remap.data && (
              <ColumnMapStep
                fileName={remap.data.fileName}
                proposal={remap.data.preview.proposal}
                sampleRows={remap.data.preview.sampleRows}
                {...(() => {
                  const p = mapCoveringHeaders(presets.data?.presets, remap.data.preview.headers);
                  return p ? { preset: p } : {};
                })()}
                canSavePreset={teamId !== null && canSavePreset}
                onCancel={endRemap}
                onConfirm={(columnMap, presetName) => {
                  const flightId = remap.data.flightId;
                  if (presetName && teamId) savePreset.mutate({ name: presetName, columnMap });
                  saveRereadMap(flightId, columnMap).then(
                    () => navigate(`/flights/${encodeURIComponent(flightId)}/filters`),
                    (e: unknown) => setRemapError(e instanceof Error ? e.message : String(e)),
                  );
                }}
              />
            )}
          </section>
        )}
        {mapping && mapping.status.kind === 'needs-map' && (
          <ColumnMapStep
            key={mapping.id}
            fileName={mapping.file.name}
            proposal={mapping.status.proposal}
            sampleRows={mapping.status.sampleRows}
            {...(() => {
              const p = mapCoveringHeaders(presets.data?.presets, mapping.status.headers);
              return p ? { preset: p } : {};
            })()}
            canSavePreset={teamId !== null && canSavePreset}
            onCancel={() =>
              dispatch({ type: 'status', id: mapping.id, status: { kind: 'cancelled' } })
            }
            onConfirm={(columnMap, presetName) => {
              if (presetName && teamId) savePreset.mutate({ name: presetName, columnMap });
              dispatch({ type: 'map', id: mapping.id, columnMap });
            }}
          />
        )}
        {savePreset.isError && (
          <p role="alert" className="text-sm text-sev-act">
            The preset was not saved: {savePreset.error.message}. The file is still read with your
            map.
          </p>
        )}
        {jobs.length > 0 && (
          <ul className="flex flex-col gap-2" aria-label="Imports">
            {jobs.map((job) => (
              <JobRow
                key={job.id}
                job={job}
                onCancel={() => cancel(job.id)}
                onRetry={() => dispatch({ type: 'retry', id: job.id })}
                onRemove={() => dispatch({ type: 'remove', id: job.id })}
                onOpenMap={() => void openMap(job)}
              />
            ))}
          </ul>
        )}
      </div>
      {/* On narrow screens the aircraft comes first: it is picked before the logs are dropped. */}
      <aside className="order-first flex flex-col gap-4 lg:order-none">
        <AircraftPicker
          teamId={teamId}
          value={aircraftId}
          onChange={(id, a) => {
            setAircraftId(id);
            setAircraft(a);
          }}
        />
        <p className="text-xs leading-relaxed text-ink-soft">
          The airframe decides what each motor is expected to carry. With an assumed quad X, an
          asymmetric frame shows up as imbalance that is really geometry.
        </p>
        <Caution title="Before you check anything on the bench">
          <p>
            Take the props off before powering the aircraft on the bench. Disconnect the pack before
            touching motors or wiring, and keep LiPo packs within their voltage and temperature
            limits.
          </p>
        </Caution>
      </aside>
    </div>
  );
}
