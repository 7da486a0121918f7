// Test fixtures read as text through the bundler's `?raw` suffix (vitest), so calc needs no file I/O.
declare module '*?raw' {
  const text: string;
  export default text;
}
