// Runs work while holding a lock shared by every tab of this browser (Web Locks); where the API is
// missing (old browsers, tests in Node) it simply runs the work.
export async function withWebLock<T>(name: string, work: () => Promise<T>): Promise<T> {
  const locks = typeof navigator === "undefined" ? undefined : navigator.locks;
  if (locks === undefined) return work();
  const done: { result?: { value: T } } = {};
  await locks.request(name, async () => {
    done.result = { value: await work() };
  });
  if (done.result === undefined) throw new Error(`The lock ${name} was released without running`);
  return done.result.value;
}
