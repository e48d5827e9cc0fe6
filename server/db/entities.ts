import { PasswordReset } from '../auth/password-reset.entity';
import { Session } from '../auth/session.entity';
import { User } from '../auth/user.entity';
import { Comment } from '../comments/comment.entity';
import { Aircraft } from '../aircraft/aircraft.entity';
import { BenchRun } from '../aircraft/bench-run.entity';
import { ServiceEntry } from '../aircraft/service-entry.entity';
import { FlightPayload } from '../flights/flight-payload.entity';
import { Flight } from '../flights/flight.entity';
import { ImportPreset } from '../presets/preset.entity';
import { Invite } from '../teams/invite.entity';
import { Membership } from '../teams/membership.entity';
import { Team } from '../teams/team.entity';

/** Every TypeORM entity, listed by hand (no globs: tsx and Vite do not resolve them). */
export const entities = [
  User,
  Session,
  PasswordReset,
  Team,
  Membership,
  Invite,
  Aircraft,
  ServiceEntry,
  BenchRun,
  Flight,
  FlightPayload,
  Comment,
  ImportPreset,
];
