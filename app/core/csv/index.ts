export {
  csvCell,
  csvCommentLine,
  csvRow,
  FORMULA_TRIGGERS,
  startsLikeFormula,
  type CsvCellOptions,
  type CsvValue,
} from "./cell";
