// A number with its noun in the right form: "1 sheet", "2 sheets", "0 pages". The
// choice is CLDR's English plural rule through Intl.PluralRules ("one" for exactly 1).
const english = new Intl.PluralRules('en');

export function counted(n: number, one: string, other = `${one}s`): string {
  return `${n.toLocaleString('en')} ${english.select(n) === 'one' ? one : other}`;
}
