/** Where the shift log lives in the desk's navigation. */
export const SHIFT_LOG_PATH = '/shift-log';
