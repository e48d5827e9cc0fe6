import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import { useParams, useSearchParams } from 'react-router-dom';
import { useQueryClient } from '@tanstack/react-query';
import { useFlightComments } from '../../api/comments';
import { useAircraftFlights } from '../../api/flight-list';
import { flightKeys, useReviewFlight, type ReviewFlight } from '../../api/flights';
import { ReviewPage } from '../../features/review/components/review-page';
import { useAircraftAirframe } from '../../features/review/model/use-aircraft-airframe';
import { defaultSection, isSectionId } from '../../features/review/model/sections';
import { useCursor } from '../../features/review/model/use-cursor';
import { useDrift } from '../../features/review/model/use-drift';
import {
  CommentsRail,
  type CommentsRailHandle,
} from '../../features/comments/components/comments-rail';
import { ComparePanel } from '../../features/compare/components/compare-panel';
import { useMe } from '../../api/session';
import { useActiveTeam } from '../../features/session/active-team';
import { AssignAircraft } from '../../features/import/components/assign-aircraft';
import { useCompare } from '../../features/compare/model/use-compare';
import { can } from '../../../shared/auth/permissions';
import { ReviewDecision, ReviewStateLine } from '../../features/review/components/review-decision';

export function ReviewRoute() {
  const { flightId = '' } = useParams();
  const flight = useReviewFlight(flightId);
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

function LoadedReview({ flight }: { flight: ReviewFlight }) {
  const { section } = useParams();
  const [params] = useSearchParams();
  const { report } = flight;
  const [cursorT, setCursor] = useCursor(report.durationS);
  const me = useMe().data ?? null;
  const sectionId = isSectionId(section) ? section : defaultSection(report.findings);
  const signedIn = me !== null;

  const aircraft = useAircraftAirframe(flight, signedIn);
  const drift = useDrift(flight, {
    signedIn,
    aircraftName: aircraft.aircraftName ?? flight.aircraftName,
  });
  const role = me?.teams.find((t) => t.id === flight.teamId)?.role ?? null;

  const onServer = signedIn && flight.teamId !== null && flight.syncedToTeam;
  const comments = useFlightComments(flight.id, onServer);
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
  const onPin = useCallback(
    (id: string) => {
      setSelected(id);
      document
        .getElementById(`comment-${id}`)
        ?.scrollIntoView({ block: 'nearest', behavior: 'smooth' });
    },
    [setSelected],
  );

  const compare = useCompare(flight, { active: sectionId === 'compare', onServer });

  const queryClient = useQueryClient();
  const { team } = useActiveTeam();
  const canFile =
    signedIn &&
    flight.source === 'local' &&
    flight.aircraftId === null &&
    team !== undefined &&
    can(team.role, 'flights.upload');
  const status = canFile ? (
    <AssignAircraft
      flightId={flight.id}
      file={flight.file}
      fileName={flight.fileName}
      teamId={flight.teamId ?? team!.id}
      onDone={() => void queryClient.invalidateQueries({ queryKey: flightKeys.detail(flight.id) })}
    />
  ) : flight.source === 'local' ? (
    <p className="text-xs text-ink-faint">
      kept on this device
      {flight.syncedToTeam
        ? ' · stored by the team'
        : !can(role ?? team?.role, 'flights.upload')
          ? ' · not synced (your role reads flights but does not add them)'
          : flight.teamId
            ? ' · syncs to the team when online'
            : ' · not in a team yet'}
    </p>
  ) : (
    <p className="text-xs text-ink-faint">stored by the team</p>
  );
  // Read from this device, the flight's review state comes from the team's list of its aircraft.
  const listed = useAircraftFlights(
    flight.teamId ?? '',
    flight.aircraftId ?? '',
    onServer && flight.reviewState === null && flight.aircraftId !== null,
  );
  const reviewState =
    flight.reviewState ?? listed.data?.flights.find((f) => f.id === flight.id)?.reviewState ?? null;
  const review =
    onServer && reviewState !== null ? (
      can(role, 'flights.review') ? (
        <ReviewDecision flightId={flight.id} state={reviewState} />
      ) : (
        <ReviewStateLine state={reviewState} />
      )
    ) : null;

  return (
    <ReviewPage
      flight={flight}
      airframe={aircraft.airframe}
      airframeAssumed={aircraft.assumed}
      section={sectionId}
      cursorT={cursorT}
      onCursor={setCursor}
      pins={pins}
      onPin={onPin}
      onCommentAtCursor={() => rail.current?.composeAtCursor()}
      drift={drift}
      status={
        <>
          {status}
          {review}
        </>
      }
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
          {...compare}
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
