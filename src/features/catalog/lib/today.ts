/** Today's date where the user is (not in UTC), as YYYY-MM-DD: the default date a new price takes effect. */
export function today(now = new Date()) {
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${now.getFullYear()}-${pad(now.getMonth() + 1)}-${pad(now.getDate())}`;
}
