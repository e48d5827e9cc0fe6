/**
 * API paths shared by the client and the server so neither spells them alone. Patterns use
 * Express parameters; the client fills them with `pathTo`.
 */
export const paths = {
  health: '/api/health',

  signUp: '/api/auth/sign-up',
  signIn: '/api/auth/sign-in',
  signOut: '/api/auth/sign-out',
  me: '/api/auth/me',
  password: '/api/auth/password',
  resetRequest: '/api/auth/reset/request',
  resetConfirm: '/api/auth/reset/confirm',

  teams: '/api/teams',
  team: '/api/teams/:teamId',
  members: '/api/teams/:teamId/members',
  member: '/api/teams/:teamId/members/:userId',
  invites: '/api/teams/:teamId/invites',
  teamInvite: '/api/teams/:teamId/invites/:inviteId',
  invite: '/api/invites/:token',
  acceptInvite: '/api/invites/:token/accept',
  thresholds: '/api/teams/:teamId/thresholds',
  presets: '/api/teams/:teamId/presets',
  preset: '/api/presets/:id',

  teamAircraft: '/api/teams/:teamId/aircraft',
  aircraft: '/api/aircraft/:id',
  serviceLog: '/api/aircraft/:id/service-log',
  serviceEntry: '/api/aircraft/:id/service-log/:entryId',
  benchRuns: '/api/aircraft/:id/bench-runs',
  benchRun: '/api/aircraft/:id/bench-runs/:runId',
  trends: '/api/aircraft/:id/trends',
  aircraftBaseline: '/api/aircraft/:id/baseline',

  teamFlights: '/api/teams/:teamId/flights',
  flight: '/api/flights/:id',
  flightRaw: '/api/flights/:id/raw',
  reviewRequest: '/api/flights/:id/review-request',
  review: '/api/flights/:id/review',
  flightComments: '/api/flights/:id/comments',
  comment: '/api/comments/:id',

  devMail: '/api/dev/mail',
} as const;

export type PathName = keyof typeof paths;

/** Fills `:param` placeholders, URL-encoding each value: pathTo('flight', { id }). */
export function pathTo(name: PathName, params: Record<string, string> = {}): string {
  return paths[name].replace(/:(\w+)/g, (_m, key: string) => {
    const value = params[key];
    if (value === undefined) throw new Error(`pathTo(${name}): missing ${key}`);
    return encodeURIComponent(value);
  });
}
