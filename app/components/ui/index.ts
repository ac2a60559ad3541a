export { Button, ButtonLink, buttonClass } from "./Button";
export { Badge, type BadgeTone, Card, EmptyState, PageHeader } from "./Card";
export { cx } from "./cx";
export { type Column, DataTable, tableToCsv } from "./DataTable";
export { FormErrors, SelectField, TextArea, TextField } from "./Field";
export { type FlashMessage, Toast } from "./Toast";
