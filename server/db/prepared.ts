// Statements prepared once per database handle and reused: building a query through Drizzle and
// preparing it in SQLite costs far more than running it, which on the path every authenticated
// request takes (session, token, membership look-ups) was most of the request's time.
/**
 * A function answering the statement `build` makes for a handle, made on the handle's first use
 * and kept as long as the handle lives (a transaction's handle gets its own, for that transaction).
 */
export function preparedPer<H extends object, S>(build: (handle: H) => S): (handle: H) => S {
  const made = new WeakMap<H, S>();
  return (handle) => {
    let statement = made.get(handle);
    if (statement === undefined) {
      statement = build(handle);
      made.set(handle, statement);
    }
    return statement;
  };
}
