import { keepPreviousData, queryOptions, useMutation, useQueryClient } from "@tanstack/react-query";
import { DEFAULT_PAGE_SIZE, type Page } from "../../shared/schemas/list";
import {
  orderStatuses, type CheckoutJson, type OrderCreateInput, type OrderFileJson, type OrderJson, type OrderListQuery, type OrderStatus, type OrderSummaryJson,
  type OrderUpdateInput, type RefundCreateInput, type ShipmentCreateInput,
} from "../../shared/schemas/order";
import { api } from "./client";
import { quoteKeys } from "./quotes";

export type { CheckoutJson, OrderFileJson, OrderJson, OrderSummaryJson };

export interface OrderFilters {
  page: number;
  pageSize: number;
  q: string;
  status: OrderStatus | "";
  sort: NonNullable<OrderListQuery["sort"]>;
  dir: "asc" | "desc";
}

const SORTS = ["createdAt", "number", "total", "status", "requestedDate"] as const;

export const orderKeys = {
  all: ["orders"] as const,
  lists: () => [...orderKeys.all, "list"] as const,
  list: (filters: OrderFilters) => [...orderKeys.lists(), filters] as const,
  details: () => [...orderKeys.all, "detail"] as const,
  detail: (id: string) => [...orderKeys.details(), id] as const,
};

export function orderFiltersFrom(search: URLSearchParams): OrderFilters {
  const page = Number.parseInt(search.get("page") ?? "1", 10);
  const status = search.get("status") as OrderStatus;
  const sort = search.get("sort") as OrderFilters["sort"];
  return {
    page: Number.isFinite(page) && page >= 1 ? page : 1,
    pageSize: DEFAULT_PAGE_SIZE,
    q: (search.get("q") ?? "").trim().slice(0, 100),
    status: orderStatuses.includes(status) ? status : "",
    sort: SORTS.includes(sort) ? sort : "createdAt",
    dir: search.get("dir") === "asc" ? "asc" : "desc",
  };
}

export const ordersQueryOptions = (filters: OrderFilters) =>
  queryOptions({
    queryKey: orderKeys.list(filters),
    queryFn: ({ signal }) => api.get<Page<OrderSummaryJson>>("/api/orders", { query: { ...filters }, signal }),
    placeholderData: keepPreviousData,
  });

/**
 * One order. Back from the checkout page the order is polled until the signed payment event has
 * marked it paid (the browser's return itself proves nothing), for at most a couple of minutes.
 */
export const orderQueryOptions = (id: string, opts: { awaitingPayment?: boolean } = {}) =>
  queryOptions({
    queryKey: orderKeys.detail(id),
    queryFn: ({ signal }) => api.get<OrderJson>(`/api/orders/${encodeURIComponent(id)}`, { signal }),
    refetchInterval: (query) => (opts.awaitingPayment && query.state.data?.status === "awaiting_payment" && query.state.dataUpdateCount < 60 ? 2000 : false),
  });

export const invoicePdfUrl = (orderId: string) => `/api/orders/${encodeURIComponent(orderId)}/invoice.pdf`;

function useOrderMutation<TVars, TResult>(fn: (vars: TVars) => Promise<TResult>, orderId: (vars: TVars) => string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: fn,
    onSuccess: (result, vars) => {
      if (result && typeof result === "object" && "status" in result && "payments" in result) queryClient.setQueryData(orderKeys.detail(orderId(vars)), result as unknown as OrderJson);
      else void queryClient.invalidateQueries({ queryKey: orderKeys.detail(orderId(vars)) });
      void queryClient.invalidateQueries({ queryKey: orderKeys.lists() });
    },
  });
}

export function usePlaceOrder() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: OrderCreateInput) => api.post<OrderJson>("/api/orders", body),
    onSuccess: (order) => {
      queryClient.setQueryData(orderKeys.detail(order.id), order);
      void queryClient.invalidateQueries({ queryKey: orderKeys.lists() });
      void queryClient.invalidateQueries({ queryKey: quoteKeys.all }); // the quote now reads as ordered
    },
  });
}

export const useUpdateOrder = () =>
  useOrderMutation(({ id, ...body }: OrderUpdateInput & { id: string }) => api.patch<OrderJson>(`/api/orders/${encodeURIComponent(id)}`, body), (v) => v.id);

export const useCancelOrder = () => useOrderMutation((id: string) => api.post<OrderJson>(`/api/orders/${encodeURIComponent(id)}/cancel`), (id) => id);

/** Opens the hosted checkout; the page then goes to `checkoutUrl`. A double click gets the same session. */
export const useStartCheckout = () => useOrderMutation((id: string) => api.post<CheckoutJson>(`/api/orders/${encodeURIComponent(id)}/checkout`), (id) => id);

export const useRefundOrder = () =>
  useOrderMutation(({ id, ...body }: RefundCreateInput & { id: string }) => api.post<OrderJson>(`/api/orders/${encodeURIComponent(id)}/refunds`, body), (v) => v.id);

export const useUploadDrawings = () =>
  useOrderMutation(({ id, files }: { id: string; files: File[] }) => {
    const form = new FormData();
    for (const f of files) form.append("file", f, f.name);
    return api.post<{ files: OrderFileJson[] }>(`/api/orders/${encodeURIComponent(id)}/files`, form);
  }, (v) => v.id);

export const useRemoveDrawing = () =>
  useOrderMutation(({ orderId, fileId }: { orderId: string; fileId: string }) => api.delete<void>(`/api/orders/${encodeURIComponent(orderId)}/files/${encodeURIComponent(fileId)}`), (v) => v.orderId);

/** The planner releases a paid order to the floor: the answer lists its lots and their jobs' codes. */
export const useReleaseOrder = () => useOrderMutation((id: string) => api.post<OrderJson>(`/api/orders/${encodeURIComponent(id)}/release`), (id) => id);

/** A parcel with packed lots leaves the shop; the last one ships the order. */
export const useRecordShipment = () =>
  useOrderMutation(({ id, ...body }: ShipmentCreateInput & { id: string }) => api.post<OrderJson>(`/api/orders/${encodeURIComponent(id)}/shipments`, body), (v) => v.id);
