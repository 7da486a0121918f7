// Source files read as text in tests (Vite's ?raw suffix), e.g. to check doc comments.
declare module '*?raw' {
  const text: string;
  export default text;
}
