export { Button, Drawing, Field, formatMoney, Length, Money, Notice, Panel } from './components';
export { api, ApiRequestError } from './api-client';
export { applyServerIssues } from './form-errors';
