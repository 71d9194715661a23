/** How a bench line says whether its figure meets its target. */
export function verdict(holds: boolean): string {
  return holds ? 'holds' : 'MISSED';
}
