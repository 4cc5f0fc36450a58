/** Text files bundled into the page at build time (webpack's asset/source, vite's ?raw). */
declare module "*?raw" {
  const text: string;
  export default text;
}
