import type { Mailer } from '../mail/mailer';

/** A mailer that sends nothing: the demo loader's comments and mentions must not fill inboxes. */
export function discardingMailer(): Mailer {
  return {
    send: async () => {},
    queue: () => {},
    track: (work) => {
      void work.catch(() => {});
    },
    idle: async () => {},
    inbox: null,
    close: async () => {},
  };
}
