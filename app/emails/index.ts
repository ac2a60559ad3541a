export { EmailLayout, emailColors, emailStyles } from "./EmailLayout";
export { RoleChangeEmail, ROLE_CHANGE_SUBJECT, type RoleChangeEmailProps } from "./RoleChangeEmail";
export { SignInLinkEmail, SIGN_IN_LINK_SUBJECT, type SignInLinkEmailProps } from "./SignInLinkEmail";
