// jstat ships no types; only the default import works from ESM.
declare module 'jstat' {
  const jStat: any;
  export default jStat;
}
