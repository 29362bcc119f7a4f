// zod 4 probes `new Function` for faster parsing; our CSP forbids eval, so the
// client runs zod without it (no CSP violation reports, same results).
import { z } from 'zod';
import { installPlainZodMessages } from '@shared/schemas/plain-errors';

z.config({ jitless: true });
// The same plain messages as the API's, so a form says what the server would.
installPlainZodMessages();
