const NAMES: Record<string, string> = {
  none: 'none (no mean-stress correction)',
  morrow: 'Morrow',
  modifiedMorrow: 'modified Morrow (Manson-Halford)',
  smithWatsonTopper: 'Smith-Watson-Topper',
  walker: 'Walker',
};

/** The name of a damage parameter (mean-stress correction) for people; unknown names pass through. */
export function correctionName(name: string): string {
  return Object.prototype.hasOwnProperty.call(NAMES, name) ? NAMES[name] : name;
}
