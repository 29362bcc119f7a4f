// Password hashing and checking (bcrypt, cost 10) in a small pool of its own, off the request thread.
// It is not the heavy-work pool: a sign-in must not wait for, or be refused because of, someone's
// export or plan run. One thread, two at most; every call is a short, bounded piece of work.
import { Piscina } from 'piscina';

const COST = 10;

let pool: Piscina | null = null;
function passwordPool() {
  pool ??= new Piscina({
    filename: new URL('./password-worker.mjs', import.meta.url).href,
    minThreads: 0,
    maxThreads: 2,
    // Idle threads are unreferenced (they never keep the process alive) and end after a minute.
    idleTimeout: 60_000,
    atomics: 'disabled',
  });
  return pool;
}

export const hashPassword = (plain: string): Promise<string> => passwordPool().run({ op: 'hash', plain, cost: COST });
export const verifyPassword = (plain: string, hash: string): Promise<boolean> =>
  passwordPool().run({ op: 'compare', plain, hash });

export const DEMO_PASSWORD = 'wearcourse-demo';
