/** The reviewer commands, registered together in main.ts. */
export { review } from './review';
export { robust } from './robust';
export { diff } from './diff';
export { instruments } from './instruments';
