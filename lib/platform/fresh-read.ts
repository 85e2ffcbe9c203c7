/**
 * Shares one read among callers that arrive together, without ever answering a caller from a read
 * that began before it called: the first caller starts a read; callers that arrive while it runs
 * wait for the next read, which starts when the running one settles, and share it. So every answer
 * is at least as fresh as a read of the caller's own (read-your-writes holds), and under load one
 * read per round trip serves every request in between. For the runs list's version stamp
 * (`lib/data/run-list-memo.ts`), only where every read goes to the same server.
 */
export function freshReads<T>(read: () => Promise<T>): () => Promise<T> {
  let running: Promise<T> | null = null;
  let next: Promise<T> | null = null;
  const start = (): Promise<T> => {
    const current = read();
    running = current;
    const clear = () => {
      if (running === current) running = null;
    };
    current.then(clear, clear);
    return current;
  };
  return () => {
    if (!running) return start();
    next ??= running.then(
      () => undefined,
      () => undefined,
    ).then(() => {
      next = null;
      return start();
    });
    return next;
  };
}
