export { Button, ButtonLink, buttonClass } from "./Button";
export { Badge, Card, EmptyState, PageHeader, type BadgeTone } from "./Card";
export { DataTable, tableToCsv, type Column } from "./DataTable";
export { FormErrors, SelectField, TextArea, TextField } from "./Field";
export { Toast, type FlashMessage } from "./Toast";
export { cx } from "./cx";
