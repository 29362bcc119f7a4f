// The password worker: bcrypt (bcryptjs, pure JavaScript) hashes and compares here, off the request
// thread. One compare at cost 10 holds a thread for about 65 ms (measured, see docs/DECISIONS.md);
// on the request thread that froze every other answer for as long, at each sign-in.
import bcrypt from 'bcryptjs';

export default function passwordWork({ op, plain, hash, cost }) {
  return op === 'hash' ? bcrypt.hashSync(plain, cost) : bcrypt.compareSync(plain, hash);
}
