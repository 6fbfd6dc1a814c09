"use client";

import dynamic from "next/dynamic";

// The charting library is most of the learner's home page's script; the bars follow the page
// instead of holding up its first paint, in a box of their final size so nothing moves.
export const LabScoreChart = dynamic(() => import("./lab-score-bars").then((module) => module.LabScoreBars), {
  ssr: false,
  loading: () => <div className="h-56 w-full animate-pulse rounded-lg bg-sunken" aria-hidden="true" />,
});
