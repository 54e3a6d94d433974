import { createApp } from './http/app.js';

/** Workers runtime entry point: the same app, one instance per isolate. */
export default createApp();
