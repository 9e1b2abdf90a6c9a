import { Card } from '@/components/ui/card';
import { PageHeader } from '@/components/ui/page-header';
import { Can } from '@/lib/ability';
import { ProductForm } from '@/features/stock/components/product-form';
import { ProductsTable } from '@/features/stock/components/products-table';
import { StockNav } from '@/features/stock/components/stock-nav';

export function ProductsPage() {
  return (
    <>
      <PageHeader title="Products">
        The chemicals the firm carries: pack sizes, dose rules, targets and safety data sheets.
      </PageHeader>
      <StockNav />
      <div className="space-y-5">
        <Card title="Products">
          <ProductsTable />
        </Card>
        <Can I="create" a="Product">
          <Card title="New product" description="Take the figures from the product’s label and its safety data sheet.">
            <ProductForm />
          </Card>
        </Can>
      </div>
    </>
  );
}
