import { TableToolbarSearch } from '@carbon/react';

interface TableSearchProps {
  labelText: string;
  placeholder: string;
  value: string;
  onSearch: (text: string) => void;
}

/** An always-open search box for a table toolbar, reporting plain text. */
export function TableSearch({ labelText, placeholder, value, onSearch }: TableSearchProps) {
  return (
    <TableToolbarSearch
      persistent
      labelText={labelText}
      placeholder={placeholder}
      value={value}
      onChange={(event) => {
        // Carbon may also call this with '' (for a default value); only input events carry the typed text.
        if (event && typeof event !== 'string') onSearch(event.target.value);
      }}
    />
  );
}
