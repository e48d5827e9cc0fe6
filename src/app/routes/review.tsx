import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import { useParams, useSearchParams } from 'react-router-dom';
import { useQuery, useQueryClient } from '@tanstack/react-query';
import { reviewQueries, type ReviewFlight } from '../../features/review/api/flight-api';
import { ReviewPage } from '../../features/review/components/review-page';
import { assumedAirframe } from '../../features/review/model/assumed-airframe';
import { defaultSection, isSectionId } from '../../features/review/model/sections';
import { useCursor } from '../../features/review/model/use-cursor';
import { commentQueries } from '../../features/comments/api/comment-queries';
import {
  CommentsRail,
  type CommentsRailHandle,
} from '../../features/comments/components/comments-rail';
import {
  ComparePanel,
  type CompareCandidate,
} from '../../features/compare/components/compare-panel';
import { useMe } from '../../features/session/api/session-queries';
import { useActiveTeam } from '../../features/session/active-team';
import { AssignAircraft } from '../../features/import/components/assign-aircraft';
import { listLocalFlights } from '../../lib/local-db';

export function ReviewRoute() {
  const { flightId = '' } = useParams();
  const flight = useQuery(reviewQueries.flight(flightId));
  if (flight.isPending) return <p className="text-sm text-ink-soft">Opening the flight…</p>;
  if (flight.isError)
    return (
      <div role="alert" className="rounded border-l-4 border-sev-act bg-paper-raised px-4 py-3">
        <h1 className="text-lg font-semibold text-slate-brand">This flight cannot be opened</h1>
        <p className="mt-1 text-sm text-ink-soft">{flight.error.message}</p>
      </div>
    );
  return <LoadedReview flight={flight.data} />;
}

const flightLabel = (f: { recordedAt: string | null; fileName: string }) => {
  const d = f.recordedAt ? new Date(f.recordedAt) : null;
  return d && !Number.isNaN(d.getTime())
    ? `${d.toLocaleDateString('en-GB', { day: 'numeric', month: 'short' })} ${d.toLocaleTimeString('en-GB', { hour: '2-digit', minute: '2-digit' })} · ${f.fileName}`
    : f.fileName;
};

function LoadedReview({ flight }: { flight: ReviewFlight }) {
  const { section } = useParams();
  const [params, setParams] = useSearchParams();
  const { report } = flight;
  const [cursorT, setCursor] = useCursor(report.durationS);
  const me = useMe().data ?? null;
  const sectionId = isSectionId(section) ? section : defaultSection(report.findings);
  const signedIn = me !== null;

  const aircraft = useQuery({
    ...reviewQueries.aircraft(flight.aircraftId ?? ''),
    enabled: signedIn && flight.aircraftId !== null,
  });
  const airframe = aircraft.data?.airframe ?? assumedAirframe(report.motorCount);
  const role = me?.teams.find((t) => t.id === flight.teamId)?.role ?? null;

  const onServer = signedIn && flight.teamId !== null && flight.syncedToTeam;
  const comments = useQuery({ ...commentQueries.flight(flight.id), enabled: onServer });
  const pins = useMemo(
    () =>
      (comments.data?.comments ?? [])
        .filter((c) => c.parentId === null && !c.deleted)
        .map((c) => ({ id: c.id, tS: c.tS, resolved: c.resolvedAt !== null })),
    [comments.data],
  );
  const [selected, setSelected] = useState<string | null>(() => params.get('comment'));
  // A link to a comment (from an e-mail) opens the moment it is pinned to.
  const linked = params.get('comment');
  const linkedTS = comments.data?.comments.find((c) => c.id === linked)?.tS;
  const hasT = params.has('t');
  useEffect(() => {
    if (linkedTS !== undefined && !hasT) setCursor(linkedTS);
  }, [linkedTS, hasT, setCursor]);
  useEffect(() => {
    if (linked && linkedTS !== undefined)
      document.getElementById(`comment-${linked}`)?.scrollIntoView({ block: 'nearest' });
  }, [linked, linkedTS]);
  const rail = useRef<CommentsRailHandle>(null);
  const onPin = useCallback((id: string) => {
    setSelected(id);
    document
      .getElementById(`comment-${id}`)
      ?.scrollIntoView({ block: 'nearest', behavior: 'smooth' });
  }, []);

  // Compare: other flights of the same aircraft, from the team server and from this device.
  const vs = params.get('vs');
  const serverList = useQuery({
    ...reviewQueries.aircraftFlights(flight.teamId ?? '', flight.aircraftId ?? ''),
    enabled: sectionId === 'compare' && onServer && flight.aircraftId !== null,
  });
  const localList = useQuery({
    queryKey: ['review', 'local-flights'],
    queryFn: listLocalFlights,
    enabled: sectionId === 'compare',
  });
  const candidates: CompareCandidate[] = useMemo(() => {
    const seen = new Set<string>([flight.id]);
    const out: CompareCandidate[] = [];
    for (const f of serverList.data?.flights ?? []) {
      if (seen.has(f.id)) continue;
      seen.add(f.id);
      out.push({ id: f.id, label: flightLabel(f) });
    }
    for (const f of localList.data ?? []) {
      if (seen.has(f.id)) continue;
      const same =
        flight.aircraftId !== null
          ? f.aircraftId === flight.aircraftId
          : !f.aircraftId && f.report.motorCount === report.motorCount;
      if (!same) continue;
      seen.add(f.id);
      out.push({
        id: f.id,
        label: `${flightLabel({ recordedAt: f.recordedAt ?? new Date(f.savedAt).toISOString(), fileName: f.fileName })} (this device)`,
      });
    }
    return out;
  }, [serverList.data, localList.data, flight.id, flight.aircraftId, report.motorCount]);
  const other = useQuery({
    ...reviewQueries.flight(vs ?? ''),
    enabled: sectionId === 'compare' && vs !== null,
  });

  const queryClient = useQueryClient();
  const { team } = useActiveTeam();
  const canFile =
    signedIn &&
    flight.source === 'local' &&
    flight.aircraftId === null &&
    team !== undefined &&
    team.role !== 'viewer' &&
    team.role !== 'coach';
  const status = canFile ? (
    <AssignAircraft
      flightId={flight.id}
      file={flight.file}
      fileName={flight.fileName}
      teamId={flight.teamId ?? team!.id}
      onDone={() =>
        void queryClient.invalidateQueries({ queryKey: reviewQueries.flight(flight.id).queryKey })
      }
    />
  ) : flight.source === 'local' ? (
    <p className="text-xs text-ink-faint">
      kept on this device
      {flight.teamId ? ' · syncs to the team when online' : ' · not in a team yet'}
    </p>
  ) : (
    <p className="text-xs text-ink-faint">stored by the team</p>
  );

  return (
    <ReviewPage
      flight={flight}
      airframe={airframe}
      airframeAssumed={!aircraft.data}
      section={sectionId}
      cursorT={cursorT}
      onCursor={setCursor}
      pins={pins}
      onPin={onPin}
      onCommentAtCursor={() => rail.current?.composeAtCursor()}
      status={status}
      rail={
        <CommentsRail
          ref={rail}
          flightId={flight.id}
          teamId={onServer ? flight.teamId : null}
          waitingForSync={signedIn && flight.teamId !== null && !flight.syncedToTeam}
          me={me ? { id: me.id, name: me.name } : null}
          role={role}
          pilotId={flight.pilotId ?? (flight.source === 'local' ? (me?.id ?? null) : null)}
          cursorT={cursorT}
          onSeek={setCursor}
          selectedId={selected}
          onSelect={setSelected}
        />
      }
      compare={
        <ComparePanel
          current={{ label: 'this flight', report: flight.report, detail: flight.detail }}
          candidates={candidates}
          otherId={vs}
          onPick={(id) =>
            setParams(
              (old) => {
                const next = new URLSearchParams(old);
                next.set('vs', id);
                return next;
              },
              { replace: true },
            )
          }
          other={
            other.data
              ? {
                  label: flightLabel(other.data),
                  report: other.data.report,
                  detail: other.data.detail,
                }
              : null
          }
          loading={other.isFetching}
          error={other.isError ? other.error.message : null}
          emptyReason={
            flight.aircraftId === null
              ? 'This flight was imported without an aircraft; flights of the assumed quad on this device are offered when there are any.'
              : undefined
          }
        />
      }
    />
  );
}
