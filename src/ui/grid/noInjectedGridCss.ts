// Stands in for the grid library's stylesheet-as-a-string (see the alias in vite.config.ts):
// the same stylesheet is loaded as a CSS file instead, and the grid is told not to inject it.
export default '';
