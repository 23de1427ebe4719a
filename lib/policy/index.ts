export {
  SAFETY_TOPIC_KEYS,
  SAFETY_TOPICS,
  topicLabel,
  topicPrompt,
  type SafetyTopic,
  type SafetyTopicKey,
} from "./topics";
export {
  CURRENT_POLICY_REVISION,
  POLICY_REVISIONS,
  TOPIC_CONDITIONS,
  getPolicyRevision,
  type PolicyRevision,
  type TopicCondition,
  type TopicRule,
} from "./revisions";
export { hazardProfile, type HazardProfile, type SafetyDeclaration } from "./hazard-profile";
export {
  FINDING_CODES,
  checkSafetySheet,
  countWords,
  describesHandDischarge,
  type CheckSafetySheetInput,
  type FindingCode,
  type SafetyFinding,
  type SafetyNote,
  type SafetySheetCheck,
  type SheetStatus,
} from "./check-safety-sheet";
