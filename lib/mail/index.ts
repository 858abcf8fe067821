// The fake SMTP server is imported from "./fake-smtp" directly, so pages never bundle it.
export { DEFAULT_MAIL_FROM, DEFAULT_RETRY, flushMail, getMailConfig, mailMessageSchema, queueMail, sendMail, type MailMessage, type RetryPolicy } from "./send";
export { clearCapturedMail, findCapturedMail, getCapturedMail, listCapturedMail, MAX_CAPTURED_MAIL, type CapturedMail } from "./captured-mail";
