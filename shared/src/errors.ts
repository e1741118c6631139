/** Every error the API answers has this shape; `details` names the field, row, feature or band. */
export interface ApiErrorBody {
  statusCode: number;
  message: string;
  details?: ErrorDetail[];
  requestId?: string;
}

export interface ErrorDetail {
  /** Where: a field path ("email"), a feature ("features[3]"), a row ("row 12"), a band ("band 4"). */
  where: string;
  problem: string;
}
