/**
 * What the viewer may do with one object, as the server presents it to islands. An island shows
 * or hides its controls by these; the server checks every action again when it is asked.
 */

/** For one inquiry: `{ edit: true, assign: true, delete: false }` for sales staff. */
export type LeadActions = { edit: boolean; assign: boolean; delete: boolean };
