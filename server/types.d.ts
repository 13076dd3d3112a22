import type { Role } from '../shared/permissions';

declare global {
  namespace Express {
    interface Request {
      /** Set by requireUser: the signed-in user. */
      auth?: { userId: string; email: string; name: string; sessionId: string };
      /** Set by requireTeam: the signed-in user's membership of the team in the path. */
      member?: { teamId: string; role: Role };
    }
  }
}
export {};
