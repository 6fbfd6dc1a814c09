export { ScopeView } from "./scope-view";
export { formatMilliamps, formatOptionalTime, formatTime, formatVolts } from "./format";
