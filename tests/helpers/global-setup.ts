/** Gives the run an id, so the browser tests build the client once per run however many files need it. */
export default function setup(): void {
  process.env.TALLYVOLT_TEST_RUN ??= `${process.pid}-${Date.now()}`;
}
