export { ReportView, type ReportViewProps } from "./ReportView";
export { ClaimsTable, type ClaimsTableProps } from "./ClaimsTable";
export { RestPointsTable, type RestPointsTableProps } from "./RestPointsTable";
export { SpecErrors } from "./SpecErrors";
export { ReportNotes, NOT_A_REVIEW } from "./ReportNotes";
export { VerdictBanner, claimCounts } from "./VerdictBanner";
export { StatusMark, OutcomeIcon, OUTCOME_WORDS, type Outcome } from "./StatusMark";
export { Sci } from "./Sci";
export * from "./format";
