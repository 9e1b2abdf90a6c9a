import { NavLink } from 'react-router-dom';
import { paths } from '@/config/paths';
import { useAbility } from '@/lib/ability';

const linkClass = ({ isActive }: { isActive: boolean }) =>
  `inline-flex min-h-12 items-center rounded-md border px-3 font-semibold ${
    isActive
      ? 'border-brand-700 bg-brand-700 text-white'
      : 'border-line-strong bg-card text-brand-800 hover:bg-brand-50'
  }`;

/** The stock screens are several pages; this row ties them together and hides what the member cannot do. */
export function StockNav() {
  const ability = useAbility();
  const canMove = ability.can('create', 'Stock');
  const links = [
    { to: paths.stock.getHref(), label: 'Balances', show: true, end: true },
    { to: paths.products.getHref(), label: 'Products', show: true, end: false },
    { to: paths.stockLedger.getHref(), label: 'Ledger', show: true, end: false },
    { to: paths.stockReceive.getHref(), label: 'Receive', show: canMove, end: false },
    { to: paths.stockTransfer.getHref(), label: 'Transfer', show: canMove, end: false },
    { to: paths.stockUse.getHref(), label: 'Use', show: ability.can('create', 'StockUse'), end: false },
    { to: paths.stockStocktake.getHref(), label: 'Stocktake', show: canMove, end: false },
    { to: paths.stockWriteOff.getHref(), label: 'Write off', show: canMove, end: false },
    { to: paths.restockRun.getHref(), label: 'Restock run', show: canMove, end: false },
    { to: paths.reorderList.getHref(), label: 'Reorder list', show: true, end: false },
  ];
  return (
    <nav aria-label="Stock" className="mb-5 print:hidden">
      <ul className="flex flex-wrap gap-2">
        {links
          .filter((link) => link.show)
          .map((link) => (
            <li key={link.to}>
              <NavLink to={link.to} end={link.end} className={linkClass}>
                {link.label}
              </NavLink>
            </li>
          ))}
      </ul>
    </nav>
  );
}
