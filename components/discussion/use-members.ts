"use client";
import useSWR from "swr";
import { fetchJson } from "@/lib/client/api";
import type { MemberOption } from "./mention-hint";

/** The lab's members, for the "@" hint (a lab has well under 200 people). */
export function useMembers(labId: string): MemberOption[] {
  const { data } = useSWR<{ items: MemberOption[] }>(
    `/api/v1/labs/${labId}/members?pageSize=200&sort=name&dir=asc`,
    fetchJson,
  );
  return data?.items ?? [];
}
