export { qualityStatement, improvementLimit, formatPercentUp, type QualityInput } from './quality';
export { explainUnmetNeeds, type ExplainLimits } from './unmet-needs';
export { explainRequests } from './requests';
export { explainConflicts, describeRow, type ConflictOptions } from './conflicts';
