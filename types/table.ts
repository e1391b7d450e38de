/** A column of TableData (components/table/TableData.vue). */
export interface TableColumn {
  key: string
  label: string
  numeric?: boolean
  /** The cell names its row: a `th` with `scope="row"`. */
  rowHeader?: boolean
  /** Extra classes for the column's body cells (a row header's weight, `whitespace-nowrap`…). */
  cellClass?: string
}
