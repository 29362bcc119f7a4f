/**
 * Waits for a condition the test cannot await directly (a task reaching the pool, a slot freed):
 * polls every 10 ms and gives up after many tries, naming what never happened.
 */
export async function until(cond: () => boolean | Promise<boolean>, what: string) {
  for (let i = 0; i < 3000; i++) {
    if (await cond()) return;
    await new Promise((r) => setTimeout(r, 10));
  }
  throw new Error(`never happened: ${what}`);
}
