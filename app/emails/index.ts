export {
  EmailButton,
  EmailGreeting,
  EmailLayout,
  EmailLinkFallback,
  emailColors,
  emailStyles,
} from "./EmailLayout";
export { ROLE_CHANGE_SUBJECT, RoleChangeEmail, type RoleChangeEmailProps } from "./RoleChangeEmail";
export { SIGN_IN_LATE_SUBJECT, SignInLateEmail, type SignInLateEmailProps } from "./SignInLateEmail";
export { SIGN_IN_LINK_SUBJECT, SignInLinkEmail, type SignInLinkEmailProps } from "./SignInLinkEmail";
