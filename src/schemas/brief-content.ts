import type { SchemeId } from '../engine/scheme-ids';
import type { Verdict } from '../lib/verdict';

/**
 * A brief as the customer reads it: every figure already worded and formatted. A send freezes
 * this object into `brief_versions.content`, so it must stay plain JSON and self-contained.
 */
export interface BriefContent {
  /** Shape version of this object, for readers of old frozen versions. */
  format: 1;
  title: string;
  customerName: string;
  customerContact: string;
  preparedBy: { name: string; email: string; company: string | null };
  spec: { id: string; name: string; version: number };
  engineVersion: string;
  partsLibrary: { name: string; version: string; currency: string; demo: boolean };
  /** Demo workspace: everything in the brief is invented, and the document says so. */
  demo: boolean;
  /** Input above 60 V DC (the safety caution is shown on every brief regardless). */
  hazardous: boolean;
  requirements: BriefLine[];
  verdicts: BriefVerdict[];
  counts: Record<Verdict, number>;
  recommended: BriefRecommendation | null;
  cost: BriefCost | null;
  risks: string[];
  assumptions: string[];
  summary: string;
  /** Where the recommendation came from when a decided shortlist backs it. */
  shortlist: { id: string; title: string; decidedScheme: SchemeId | null; rationale: string | null } | null;
  /** Plain notes about the draft (for example a recommendation that no longer holds). */
  notices: string[];
  chart: BriefChartBar[];
}

export interface BriefLine {
  label: string;
  value: string;
}

export interface BriefVerdict {
  scheme: SchemeId;
  label: string;
  verdict: Verdict;
  reasons: string[];
}

export interface BriefRecommendation {
  scheme: SchemeId;
  label: string;
  verdict: Verdict;
  /** `engine`: best feasible in the ranking; `edited`: chosen by the author; `shortlist`: decided by ballot. */
  source: 'engine' | 'edited' | 'shortlist';
  figures: BriefLine[];
}

export interface BriefCost {
  currency: string;
  annualVolume: number;
  /** Power-stage BOM per unit at the annual volume's price tier. */
  bomCost: number;
  lowPct: number;
  highPct: number;
  low: number;
  high: number;
  /** Roles of the BOM lines that make up the estimate. */
  covers: string[];
}

/** Primary switch stress and the rating chosen for it, per scheme (for the printed chart). */
export interface BriefChartBar {
  scheme: SchemeId;
  label: string;
  verdict: Verdict;
  stressV: number;
  ratingV: number | null;
}
