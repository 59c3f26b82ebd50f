import type { DataQuality, QualityIssue } from '../../../core/quality';

export interface IssueGroup {
  title: string;
  /** What to show when the group is empty. */
  none: string;
  issues: QualityIssue[];
}

/** The report's issues in the order a researcher fixes them: missing values, then features, then values. */
export function issueGroups(report: DataQuality): IssueGroup[] {
  return [
    { title: 'Missing values', none: 'No feature has missing values.', issues: report.missing.issues },
    { title: 'Constant and near-constant features', none: 'No feature is constant or near-constant.', issues: report.nearConstant },
    { title: 'Highly correlated pairs', none: 'No pair of features correlates above |r| = 0.95.', issues: report.correlated },
    { title: 'Extreme values', none: 'No feature has values beyond robust z 5.', issues: report.extremes },
  ];
}
