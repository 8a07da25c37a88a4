import type { User as FalsetraceUser } from '../../shared/schemas/auth';

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    // passport's req.user is our API user shape
    // eslint-disable-next-line @typescript-eslint/no-empty-object-type
    interface User extends FalsetraceUser {}
  }
}

export {};
