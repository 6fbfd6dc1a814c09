// What the hostile benchmark (scripts/bench-hostile.ts) and its attackers (attackers.ts, a child
// process) say to each other.

/**
 * One attacker: the upload route without a session, or the grading route as a signed-in learner;
 * each from an address of its own, as the balancer in front of the instance reports it (X-Forwarded-For).
 */
export type AttackTarget = { route: "upload"; address: string } | { route: "grading"; address: string; labSlug: string; cookie: string };

export type AttackerRequest = { type: "start"; baseUrl: string; targets: AttackTarget[]; bodyBytes: number } | { type: "stop" };

/** Requests of one kind of body: answers by status, exchanges ended by an error (the server closing the connection, a timeout) by code. */
export type Tally = { count: number; statuses: Record<number, number>; errors: Record<string, number>; bytesSent: number; bytesReceived: number };

export type AttackerReply = { type: "started" } | { type: "stopped"; tallies: Record<string, Tally> };
