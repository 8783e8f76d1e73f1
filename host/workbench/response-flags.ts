/**
 * How the workbench window answers a reviewer's action, as a Chromium start-up setting shared
 * by the two windows Twofold opens itself (Electron's, and Chromium's app window in browser
 * mode) and by the e2e harness, which must time the window users get.
 *
 * After a click or a key press, Chromium holds back ordinary tasks of the page, among them
 * messages from a worker, until it has drawn the next frame (its feature
 * `DeferRendererTasksAfterInput`). The workbench computes a change in its analysis worker, so
 * the worker's answer (ready 3–5 ms after the click) waited for a frame that had nothing new
 * to show, and the values could only appear one frame later. Measured in the e2e
 * (tests/e2e/review-timing.test.ts, 30 overrides of a 1,600-breath test, a Chromium trace
 * read beside it): the answer waited 10.4 ms in the median with the feature on, 0.1 ms with
 * it off; override to values painted, median 34–35 ms with it on, 20–24 ms with it off (quiet
 * machine, two and three runs). Nothing in the page depends on the deferral: it is a
 * scheduling preference of Chromium's, not a behaviour pages can rely on.
 *
 * In a browser the user opens on their own (`npm start` prints the address), the browser's
 * own setting applies and an override can take one frame longer (docs/performance.md).
 */

/** The Chromium feature turned off in Twofold's own windows (see above). */
export const DEFERRED_AFTER_INPUT_FEATURE = 'DeferRendererTasksAfterInput';

/** The command-line switch for Chromium's app window and for the e2e harness's browser. */
export const RESPONSE_FLAGS = [`--disable-features=${DEFERRED_AFTER_INPUT_FEATURE}`] as const;
