export { Alert, type AlertTone } from "./Alert";
export { Button, ButtonLink, buttonClass } from "./Button";
export { type BackLink, Badge, type BadgeTone, Card, cardClass, EmptyState, PageHeader } from "./Card";
export { cx } from "./cx";
export { type Column, DataTable, fixedColumn, namedColumn, tableToCsv } from "./DataTable";
export { type Detail, DetailList } from "./DetailList";
export { FormErrors, SelectField, TextArea, TextField } from "./Field";
export { IntentButton } from "./IntentButton";
export { type FlashMessage, Toast } from "./Toast";
