// bibtex-parse 2.1.0 ships no type declarations; the test reads entries only.
declare module "bibtex-parse" {
  const bibtexParse: { entries(bibtex: string): ({ key: string; type: string } & Record<string, unknown>)[] };
  export default bibtexParse;
}
