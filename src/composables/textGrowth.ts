/**
 * One-line text boxes that grow with their text. Where the browser sizes a box to its text
 * itself (CSS `field-sizing`, the `grows-with-text` class in main.css), no script measures every
 * box on the screen as it is drawn; elsewhere PrimeVue's auto-resize does it.
 */
export const resizeByScript = !(typeof CSS !== 'undefined' && CSS.supports('field-sizing', 'content'));
