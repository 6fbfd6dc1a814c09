// Stands in for the "server-only" guard when server modules are imported by tests outside Next.
export {};
