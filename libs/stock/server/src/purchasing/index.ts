/** Purchase orders and goods in as services, for callers outside the HTTP layer (the demo). */
export { createPurchaseOrder, type OrderInput, type OrderLineInput } from './po.repository';
export { cancelOrder, markSent, orderPdf } from './po-status';
export { receiveGoods } from './goods-in';
