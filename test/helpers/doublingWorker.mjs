// A worker module for test/jobPool.test.ts, in plain JavaScript so it needs no loader: doubles a
// number and says which thread did it; refuses negative numbers the way workerJob reports a failure.
export default function double(n) {
  if (n < 0) throw { name: "RangeError", message: `${n} is negative` };
  return { doubled: 2 * n, thread: "worker" };
}
