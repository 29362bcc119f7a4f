// zod 4 probes `new Function` for faster parsing; our CSP forbids eval, so the
// client runs zod without it (no CSP violation reports, same results).
import { z } from 'zod';

z.config({ jitless: true });
